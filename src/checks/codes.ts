import type { ColumnSpec } from "../contract/types.js";
import { keyText } from "../engine/key-text.js";
import { parseBound } from "../types/bound.js";
import type { Value } from "../values.js";
import { withArticle } from "./article.js";
import { miss, type CheckDefinition } from "./definition.js";

const LISTED = 8;

function listing(values: readonly string[]): string {
  const shown = values.slice(0, LISTED).join(", ");
  return values.length > LISTED ? `${shown}, ... (${values.length} codes)` : shown;
}

/**
 * A code as a value of the column's type, compared as keys compare (`01` is the code 1 in an integer
 * column, a date code is written ISO 8601 as bounds are); undefined when it is no such value.
 */
function typedCode(spec: ColumnSpec, code: string | number): Value | undefined {
  switch (spec.type) {
    case "integer":
    case "decimal": {
      const n = typeof code === "number" ? code : /^\s*[-+]?(\d+\.?\d*|\.\d+)\s*$/.test(code) ? Number(code) : Number.NaN;
      return Number.isFinite(n) && (spec.type === "decimal" || Number.isInteger(n)) ? n : undefined;
    }
    case "boolean":
      return code === "true" ? true : code === "false" ? false : undefined;
    default:
      return parseBound(spec, code);
  }
}

/**
 * `codes`: the cell must be one of a list, or one of a registry table column's values. Text compares
 * as trimmed text; other types compare by value, as keys do.
 */
export const codes: CheckDefinition = {
  name: "codes",
  key: "codes",
  types: ["text", "integer", "decimal", "boolean", "date", "timestamp", "time"],
  compile(spec, ctx) {
    const c = spec.codes;
    if (c === undefined) return undefined;
    let allowed: ReadonlySet<string>;
    let where: string;
    const typed = spec.type !== "text";
    if (Array.isArray(c)) {
      // A number keeps the digits the contract wrote: `2.50` is listed as 2.50.
      const written = c.map((v, i) => (typeof v === "number" ? (ctx.writtenNumber(["codes", i]) ?? String(v)) : v));
      if (typed) {
        const keys = new Set<string>();
        for (let i = 0; i < c.length; i++) {
          const v = typedCode(spec, c[i] as string | number);
          if (v === undefined) return [{ path: ["codes", i], message: `code ${JSON.stringify(c[i])} is not ${withArticle(spec.type)} value${spec.type === "date" || spec.type === "timestamp" || spec.type === "time" ? " written as ISO 8601" : ""}` }];
          // The digits as written: a YAML number past 2^53 is already rounded.
          keys.add(keyText(v, written[i] as string));
        }
        allowed = keys;
      } else allowed = new Set(written);
      // A sensitive column's codes are its values: say how many, never which.
      where = ctx.sensitive(ctx.column) ? `the ${written.length} listed codes (not shown: the column is sensitive)` : listing(written);
    } else {
      const { table, column } = c as { table: string; column: string };
      const set = ctx.codeSet(table, column);
      if (!(set instanceof Set)) {
        const wrong = set as { field: "table" | "column"; message: string };
        return [{ path: ["codes", wrong.field], message: wrong.message }];
      }
      if (typed) {
        // Table cells that are no value of this column's type can never match one.
        const keys = new Set<string>();
        for (const code of set) {
          const v = typedCode(spec, code);
          if (v !== undefined) keys.add(keyText(v, code));
        }
        allowed = keys;
      } else allowed = set;
      where = `a value of column ${column} in reference table ${table}`;
    }
    const m = miss(Array.isArray(c) ? `one of ${where}` : where, Array.isArray(c) ? "is not an allowed code" : `is not ${where}`);
    return {
      description: `${ctx.column} is ${Array.isArray(c) ? `one of ${where}` : where}`,
      test: typed ? (v: Value, text: string) => (allowed.has(keyText(v, text)) ? undefined : m) : (_v: Value, text: string) => (allowed.has(text) ? undefined : m),
    };
  },
};
