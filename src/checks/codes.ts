import { miss, type CheckDefinition } from "./definition.js";

const LISTED = 8;

function listing(values: readonly string[]): string {
  const shown = values.slice(0, LISTED).join(", ");
  return values.length > LISTED ? `${shown}, ... (${values.length} codes)` : shown;
}

/** `codes`: the trimmed text must be one of a list, or one of a registry table column's values. */
export const codes: CheckDefinition = {
  name: "codes",
  key: "codes",
  types: ["text", "integer", "decimal", "boolean", "date", "timestamp", "time"],
  compile(spec, ctx) {
    const c = spec.codes;
    if (c === undefined) return undefined;
    let allowed: ReadonlySet<string>;
    let where: string;
    if (Array.isArray(c)) {
      // A number keeps the digits the contract wrote: `2.50` allows the cell "2.50".
      allowed = new Set(c.map((v, i) => (typeof v === "number" ? (ctx.writtenNumber(["codes", i]) ?? String(v)) : v)));
      where = listing([...allowed]);
    } else {
      const { table, column } = c as { table: string; column: string };
      const set = ctx.codeSet(table, column);
      if (!(set instanceof Set)) {
        const wrong = set as { field: "table" | "column"; message: string };
        return [{ path: ["codes", wrong.field], message: wrong.message }];
      }
      allowed = set;
      where = `a value of column ${column} in reference table ${table}`;
    }
    const m = miss(Array.isArray(c) ? `one of ${where}` : where, Array.isArray(c) ? "is not an allowed code" : `is not ${where}`);
    return { description: `${ctx.column} is ${Array.isArray(c) ? `one of ${where}` : where}`, test: (_v, text) => (allowed.has(text) ? undefined : m) };
  },
};
