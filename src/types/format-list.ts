import type { SpecError } from "../contract/spec-error.js";

/** One entry of a column's `format` option with the path that points at it. */
export interface FormatEntry {
  readonly format: string;
  readonly path: readonly (string | number)[];
}

/** Normalise `format` (absent, one string, or a list) into entries; errors for empty lists and non-strings. */
export function formatEntries(format: unknown, fallback: string | undefined): { entries: FormatEntry[]; errors: SpecError[] } {
  if (format === undefined) return { entries: fallback === undefined ? [] : [{ format: fallback, path: [] }], errors: [] };
  if (typeof format === "string") return { entries: [{ format, path: ["format"] }], errors: [] };
  if (!Array.isArray(format) || format.length === 0) {
    return { entries: [], errors: [{ path: ["format"], message: "format must be a pattern or a non-empty list of patterns" }] };
  }
  const entries: FormatEntry[] = [];
  const errors: SpecError[] = [];
  format.forEach((f: unknown, i) => {
    if (typeof f === "string") entries.push({ format: f, path: ["format", i] });
    else errors.push({ path: ["format", i], message: "a format must be a string" });
  });
  return { entries, errors };
}

/** First result of several parsers tried in the order the contract lists them. */
export function firstOf<T>(parsers: readonly ((text: string) => T | undefined)[]): (text: string) => T | undefined {
  const only = parsers[0];
  if (parsers.length === 1 && only !== undefined) return only;
  return (text) => {
    for (const p of parsers) {
      const v = p(text);
      if (v !== undefined) return v;
    }
    return undefined;
  };
}

/** "a, b or c" for report texts. */
export function joinOr(items: readonly string[]): string {
  if (items.length <= 1) return items.join("");
  return `${items.slice(0, -1).join(", ")} or ${items[items.length - 1] ?? ""}`;
}
