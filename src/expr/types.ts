/** The public shapes of the expression compiler: what the caller provides and what it gets back. */
import type { ColumnType } from "../contract/types.js";
import type { Value } from "../values.js";

/** A registry table, provided by the caller. */
export interface ReferenceLookup {
  readonly columns: readonly string[];
  /** value of column `columnIndex` in the row whose key is `key`, or null when there is no such row */
  get(key: string, columnIndex: number): Value;
}

/** What an expression may see: the row's columns, the registry, and whether aggregates are allowed. */
export interface ExprEnv {
  /** column name -> index in the row array; undefined when unknown */
  column(name: string): number | undefined;
  /** registry table by name; undefined when unknown */
  table(name: string): ReferenceLookup | undefined;
  /** why a table the registry declares cannot be used (it did not load), when that is the case */
  tableTrouble?(name: string): string | undefined;
  /** group mode: allow sum(x) count() count(x) min(x) max(x) first(x); bare column refs outside an aggregate are errors */
  readonly aggregates?: boolean;
  /** group mode: the columns the group is formed by, which may stand bare for the group's value (SQL HAVING) */
  readonly groupBy?: readonly number[];
  /** declared type of a column, when known: enables type errors at compile time (date compared with a number...) */
  columnType?(index: number): ColumnType | undefined;
  /** all column names, when known: enables "did you mean" suggestions for unknown columns */
  readonly columnNames?: readonly string[];
}

/** One aggregate call of a group assert, evaluated per row of the group and accumulated. */
export interface AggregateCall {
  readonly fn: "sum" | "count" | "min" | "max" | "first";
  readonly arg: CompiledExpr | null;
}

/** An expression compiled once into closures, evaluated many times. */
export interface CompiledExpr {
  readonly source: string;
  /** column indexes the expression reads, in order of first appearance (used to explain a failure) */
  readonly columns: readonly number[];
  /** row mode: values = the row; group mode: values = results of `aggregates`, in order */
  evaluate(values: readonly Value[]): Value;
  /** group mode only: the aggregate calls, each evaluated per row and accumulated by the engine */
  readonly aggregates: readonly AggregateCall[];
}

/** A compiled expression, or the 0-based offset (UTF-16 code units) of the offending character and why. */
export type CompileResult = { ok: true; expr: CompiledExpr } | { ok: false; offset: number; message: string };

/** Static type of a sub-expression; `any` when only the row can tell (a column of unknown type). */
export type ExprType = "number" | "text" | "boolean" | "date" | "timestamp" | "time" | "null" | "any";

/** A row-level closure. */
export type Eval = (row: readonly Value[]) => Value;
