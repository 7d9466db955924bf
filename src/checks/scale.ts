import { decimalScale } from "../types/index.js";
import { miss, type CheckDefinition } from "./definition.js";

/** `scale`: at most this many digits after the decimal mark, as written. */
export const scale: CheckDefinition = {
  name: "scale",
  key: "scale",
  types: ["decimal"],
  compile(spec, ctx) {
    const limit = spec.scale ?? 0;
    const m = miss(`at most ${limit} digits after the decimal mark`, `has more than ${limit} digits after the decimal mark`);
    return { description: `${ctx.column} has at most ${limit} decimals`, test: (_v, text) => (decimalScale(text, spec) > limit ? m : undefined) };
  },
};
