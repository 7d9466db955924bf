import type { ColumnSpec, ColumnType, Level } from "../contract/types.js";
import type { SpecError } from "../contract/spec-error.js";
import type { Value } from "../values.js";

/** What one failed cell check says; the engine adds row, line, column and the shown value. */
export interface Miss {
  /** What a passing value looks like, e.g. "<= 0.6". */
  readonly expected: string;
  /** The sentence after "<column> <value>", e.g. "is above the maximum 0.6". */
  readonly reason: string;
  /** Overrides the check's level for this miss (a postal code of a country with no known layout is a note). */
  readonly level?: Level;
}

/** The row being checked, as the engine holds it: parsed values and trimmed texts by declared column. */
export interface RowView {
  readonly values: readonly Value[];
  readonly texts: readonly string[];
}

/** A compiled cell test: undefined when the cell passes. Only called on non-blank cells that parsed. */
export type CellTest = (value: Value, text: string, row: RowView) => Miss | undefined;

/** What a check needs from the rest of the contract while it compiles. */
export interface CheckContext {
  readonly column: string;
  /** Declared column name -> index in RowView arrays. */
  columnIndex(name: string): number | undefined;
  readonly columnNames: readonly string[];
  /** Values of a registry table column, or which of the two names is wrong and why. */
  codeSet(table: string, column: string): ReadonlySet<string> | { readonly field: "table" | "column"; readonly message: string };
  /** True when the named column is `sensitive`: a check must not show its values in what it reports. */
  sensitive(name: string): boolean;
  /** Today, as days since 1970-01-01 (UTC), fixed for the whole run. */
  readonly today: number;
  /**
   * A number option exactly as the contract wrote it (`path` below the column), when YAML's reading
   * as a double lost something (`2.50`, `9007199254740993`); undefined otherwise.
   */
  writtenNumber(path: readonly (string | number)[]): string | undefined;
}

export interface CompiledCheck {
  readonly test: CellTest;
  /** One line saying what the check demands, e.g. "discount at most 0.6". */
  readonly description: string;
}

/**
 * One column check: the contract key it reads (also the rule id suffix), the column types it applies
 * to, and how to compile it. `compile` is only called when the key is present in the column spec.
 */
export interface CheckDefinition {
  readonly name: string;
  readonly key: keyof ColumnSpec;
  readonly types: readonly ColumnType[];
  /** Undefined when the option is present but asks for nothing (e.g. `not_future: false`). */
  compile(spec: ColumnSpec, ctx: CheckContext): CompiledCheck | SpecError[] | undefined;
}

/** A check that always fails the same way builds its miss once. */
export const miss = (expected: string, reason: string, level?: Level): Miss => (level ? { expected, reason, level } : { expected, reason });
