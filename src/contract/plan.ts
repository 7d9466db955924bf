import type { CellTest } from "../checks/index.js";
import type { CompiledExpr } from "../expr/index.js";
import type { CheckTally, Level, SourcePos } from "../report/model.js";
import type { ColumnSpec, ColumnType, Encoding, HeaderPolicy, InputFormat } from "./types.js";
import type { Value } from "../values.js";

/** A check the plan runs, as it appears in the report's `checks` (without the count). */
export type CheckMeta = Omit<CheckTally, "failed" | "share" | "within_allowance">;

export interface CellCheckPlan {
  /** Index into `Plan.checks`. */
  readonly check: number;
  readonly test: CellTest;
}

export interface ColumnPlan {
  readonly name: string;
  /** Position among the declared columns; the engine's row arrays use it. */
  readonly index: number;
  readonly type: ColumnType;
  /** The column as the contract declares it: plain data, for preparing rows on another thread. */
  readonly spec: ColumnSpec;
  readonly parse: (text: string) => Value | undefined;
  /** What a value of the type looks like, e.g. "an integer". */
  readonly expected: string;
  readonly required: boolean;
  readonly sensitive: boolean;
  readonly typeCheck: number;
  readonly requiredCheck: number;
  /** -1 when the column allows surrounding spaces. */
  readonly spacesCheck: number;
  readonly cellChecks: readonly CellCheckPlan[];
  readonly when?: CompiledExpr;
}

export interface KeyPlan {
  readonly check: number;
  readonly columns: readonly number[];
}

export interface RulePlan {
  readonly check: number;
  readonly assert: CompiledExpr;
  readonly when?: CompiledExpr;
  readonly message?: string;
}

export interface GroupPlan {
  readonly check: number;
  readonly id: string;
  readonly by: readonly number[];
  readonly assert: CompiledExpr;
  readonly when?: CompiledExpr;
  readonly message?: string;
}

export interface OutlierPlan {
  readonly check: number;
  readonly column: number;
  readonly method: "tukey" | "mad";
  readonly k: number;
  readonly threshold: number;
}

export interface BlankSharePlan {
  readonly check: number;
  readonly column: number;
  readonly max: number;
}

/** Checks of the file as a whole, created for every plan. Indexes into `Plan.checks`. */
export interface FileChecks {
  readonly structure: number;
  readonly width: number;
  readonly headerMissing: number;
  readonly headerUnexpected: number;
  readonly headerOrder: number;
  readonly headerDuplicate: number;
}

/** A contract compiled once: everything the per-row loop needs, and nothing it must look up again. */
export interface Plan {
  readonly name: string;
  readonly version?: string;
  /** The contract file as given, and the SHA-256 of its bytes. */
  readonly path: string;
  readonly sha256: string;
  readonly input: {
    readonly format: InputFormat;
    readonly delimiter: string;
    readonly quote: string;
    readonly encoding: Encoding;
    readonly header: HeaderPolicy;
    readonly blank: ReadonlySet<string>;
  };
  readonly columns: readonly ColumnPlan[];
  readonly checks: readonly CheckMeta[];
  readonly file: FileChecks;
  readonly keys: readonly KeyPlan[];
  /** Whole-row duplicates; undefined when off. */
  readonly duplicates?: number;
  readonly rules: readonly RulePlan[];
  readonly groups: readonly GroupPlan[];
  readonly outliers: readonly OutlierPlan[];
  readonly totalRows?: { readonly check: number; readonly min?: number; readonly max?: number };
  readonly blankShares: readonly BlankSharePlan[];
  /** Registry tables the contract reads, with their versions, for the report. */
  readonly references: readonly { readonly table: string; readonly version: string; readonly sha256: string }[];
}

export type { Level, SourcePos };
