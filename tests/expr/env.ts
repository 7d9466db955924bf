import type { ColumnType } from "../../src/contract/types.js";
import { compileExpression, type CompiledExpr, type ExprEnv, type ReferenceLookup } from "../../src/expr/index.js";
import type { Value } from "../../src/values.js";

/** A small registry table for tests: invented region codes of a fictional outdoor-gear wholesaler. */
export const regions: ReferenceLookup = (() => {
  const rows: Record<string, readonly Value[]> = {
    N: ["N", "North", "Hilltop Depot"],
    S: ["S", "South", "Riverside Depot"],
    "10": ["10", "Ten", "Numbered Depot"],
  };
  return { columns: ["code", "name", "depot"], get: (key, i) => rows[key]?.[i] ?? null };
})();

/** An environment over the given columns (name -> declared type, or undefined for untyped). */
export function envOf(columns: Readonly<Record<string, ColumnType | undefined>>, options: { aggregates?: boolean; typed?: boolean } = {}): ExprEnv {
  const names = Object.keys(columns);
  return {
    column: (n) => {
      const i = names.indexOf(n);
      return i < 0 ? undefined : i;
    },
    table: (t) => (t === "regions" ? regions : undefined),
    aggregates: options.aggregates ?? false,
    columnNames: names,
    ...(options.typed === false ? {} : { columnType: (i: number) => columns[names[i] as string] }),
  };
}

/** Compile or fail the test with the compiler's message. */
export function compiled(source: string, env: ExprEnv): CompiledExpr {
  const r = compileExpression(source, env);
  if (!r.ok) throw new Error(`${source}: at ${r.offset}: ${r.message}`);
  return r.expr;
}

/** Evaluate a column-free expression. */
export function value(source: string): Value {
  return compiled(source, envOf({})).evaluate([]);
}

/** The offset at which compiling fails, or "ok". */
export function errorOffset(source: string, env: ExprEnv): number | "ok" {
  const r = compileExpression(source, env);
  return r.ok ? "ok" : r.offset;
}
