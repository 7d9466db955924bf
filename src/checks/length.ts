import { miss, type CheckDefinition } from "./definition.js";

/** Length in Unicode code points, so an accented letter or an emoji counts once. */
function codePoints(text: string): number {
  let n = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 0xd800 || c > 0xdbff) n++;
  }
  return n;
}

/** `min_length`: at least this many characters after trimming. */
export const minLength: CheckDefinition = {
  name: "min_length",
  key: "min_length",
  types: ["text"],
  compile(spec, ctx) {
    const limit = spec.min_length ?? 0;
    const m = miss(`at least ${limit} characters`, `is shorter than ${limit} characters`);
    return { description: `${ctx.column} at least ${limit} characters long`, test: (_v, text) => (text.length < limit || codePoints(text) < limit ? m : undefined) };
  },
};

/** `max_length`: at most this many characters after trimming. */
export const maxLength: CheckDefinition = {
  name: "max_length",
  key: "max_length",
  types: ["text"],
  compile(spec, ctx) {
    const limit = spec.max_length ?? Infinity;
    const m = miss(`at most ${limit} characters`, `is longer than ${limit} characters`);
    return { description: `${ctx.column} at most ${limit} characters long`, test: (_v, text) => (text.length > limit && codePoints(text) > limit ? m : undefined) };
  },
};
