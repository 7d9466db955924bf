import { miss, type CheckDefinition } from "./definition.js";
import { compileSafeRegex } from "../safe-regex.js";

/** `pattern`: an ECMAScript regular expression the trimmed text must match (anchored by the author). */
export const pattern: CheckDefinition = {
  name: "pattern",
  key: "pattern",
  types: ["text"],
  compile(spec, ctx) {
    const source = spec.pattern ?? "";
    const re = compileSafeRegex(source);
    if (!(re instanceof RegExp)) return [{ path: ["pattern"], offset: re.offset, message: re.message }];
    const m = miss(`matches ${source}`, `does not match the pattern ${source}`);
    return { description: `${ctx.column} matches ${source}`, test: (_v, text) => (re.test(text) ? undefined : m) };
  },
};
