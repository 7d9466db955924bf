import type { TypeParser } from "./parser.js";

/** Text cells are their own value; the text checks (length, pattern, format) run elsewhere. */
export const textParser: TypeParser = { parse: (text) => text, expected: "text" };
