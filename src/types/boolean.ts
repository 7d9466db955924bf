import type { SpecError } from "../contract/spec-error.js";
import type { ColumnSpec } from "../contract/types.js";
import type { CompiledType } from "./parser.js";

const DEFAULT_TRUE = ["true", "yes", "1", "y"] as const;
const DEFAULT_FALSE = ["false", "no", "0", "n"] as const;

/**
 * Compile a boolean column. Without `values`: true/false, yes/no, 1/0, y/n. With `values`, its lists
 * replace the defaults entirely. Matching ignores case (Unicode lower-casing, no locale).
 */
export function compileBoolean(spec: ColumnSpec): CompiledType {
  const words = new Map<string, boolean>();
  const errors: SpecError[] = [];
  const add = (list: readonly unknown[], value: boolean, key: "true" | "false"): void => {
    list.forEach((raw, i) => {
      // YAML may hand over numbers (1, 0) where the author meant the text "1"
      const word = String(raw);
      const lower = word.toLowerCase();
      if (word.trim() !== word || word === "") {
        errors.push({ path: ["values", key, i], message: `"${word}" can never match: cells are trimmed and blank cells skipped` });
      } else if (words.get(lower) === !value) {
        errors.push({ path: ["values", key, i], message: `"${word}" is listed as both true and false` });
      } else words.set(lower, value);
    });
  };
  const custom = spec.values;
  add(custom?.true ?? DEFAULT_TRUE, true, "true");
  add(custom?.false ?? DEFAULT_FALSE, false, "false");
  if (errors.length > 0) return { ok: false, errors };
  let longest = 0;
  for (const w of words.keys()) longest = Math.max(longest, w.length);
  const parse = (text: string): boolean | undefined => (text.length > longest ? undefined : words.get(text.toLowerCase()));
  const t = custom?.true ?? DEFAULT_TRUE;
  const f = custom?.false ?? DEFAULT_FALSE;
  const expected = `a boolean (true: ${t.map(String).join(", ")}; false: ${f.map(String).join(", ")})`;
  return { ok: true, parser: { parse, expected } };
}
