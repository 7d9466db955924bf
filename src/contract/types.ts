/** The contract as written in YAML, after it passed the contract schema. Names follow the YAML keys. */

export type Level = "error" | "warning" | "note";
export type ColumnType = "text" | "integer" | "decimal" | "boolean" | "date" | "timestamp" | "time";
export const COLUMN_TYPES: readonly ColumnType[] = ["text", "integer", "decimal", "boolean", "date", "timestamp", "time"];

export type InputFormat = "csv" | "tsv" | "ndjson" | "xlsx";
export type Encoding = "utf-8" | "utf-16le" | "utf-16be" | "windows-1252" | "latin1" | "auto";
export type HeaderPolicy = "exact" | "ordered" | "any-order" | "none";

export interface InputSpec {
  readonly format?: InputFormat;
  readonly delimiter?: string;
  readonly quote?: string;
  readonly encoding?: Encoding;
  readonly header?: HeaderPolicy;
  readonly blank?: readonly string[];
}

/** `codes:` either lists the allowed values or points at a registry table column. */
export type CodesSpec = readonly (string | number)[] | { readonly table: string; readonly column: string };

export interface ColumnSpec {
  readonly type: ColumnType;
  readonly description?: string;
  readonly required?: boolean;
  readonly level?: Level;
  readonly allow?: number;
  readonly sensitive?: boolean;
  readonly spaces?: "allow" | "warn";
  readonly when?: string;
  readonly codes?: CodesSpec;
  readonly postal?: string;
  // text
  readonly min_length?: number;
  readonly max_length?: number;
  readonly pattern?: string;
  /** text: a JSON Schema format name; date/timestamp/time: one or more parse formats */
  readonly format?: string | readonly string[];
  // integer, decimal; date/timestamp/time take ISO text here
  readonly min?: number | string;
  readonly max?: number | string;
  readonly thousands?: string;
  readonly decimal_mark?: string;
  readonly percent?: boolean;
  readonly scale?: number;
  // boolean
  readonly values?: { readonly true: readonly string[]; readonly false: readonly string[] };
  // date
  readonly not_future?: boolean;
  // timestamp
  readonly timezone?: "required" | "forbidden" | "optional";
}

export interface RuleSpec {
  readonly id: string;
  readonly description?: string;
  readonly assert: string;
  readonly when?: string;
  readonly message?: string;
  readonly level?: Level;
  readonly allow?: number;
}

export interface GroupSpec {
  readonly id: string;
  readonly description?: string;
  readonly by: string | readonly string[];
  readonly assert: string;
  readonly when?: string;
  readonly message?: string;
  readonly level?: Level;
  readonly allow?: number;
}

export interface OutlierSpec {
  readonly column: string;
  readonly method: "tukey" | "mad";
  /** tukey fence multiplier, default 1.5 */
  readonly k?: number;
  /** mad modified z-score threshold, default 3.5 */
  readonly threshold?: number;
  readonly level?: Level;
  readonly allow?: number;
}

export interface TotalsSpec {
  readonly rows?: { readonly min?: number; readonly max?: number; readonly level?: Level };
  readonly blank_share?: Readonly<Record<string, number>>;
}

export type DuplicatesSpec = Level | "off" | { readonly level: Level; readonly allow?: number };

export interface ContractSpec {
  readonly tablegate: 1;
  readonly name: string;
  readonly version?: string;
  readonly description?: string;
  readonly owner?: string;
  readonly input?: InputSpec;
  readonly columns: Readonly<Record<string, ColumnSpec>>;
  readonly keys?: readonly (string | readonly string[])[];
  readonly duplicates?: DuplicatesSpec;
  readonly rules?: readonly RuleSpec[];
  readonly groups?: readonly GroupSpec[];
  readonly totals?: TotalsSpec;
  readonly outliers?: readonly OutlierSpec[];
}
