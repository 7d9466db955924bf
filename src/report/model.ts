import type { Level } from "../contract/types.js";

export type { Level };

/** A position in a contract or registry file, 1-based. */
export interface SourcePos {
  readonly line: number;
  readonly column: number;
}

/**
 * One failed check on one place of a delivery: the single finding shape every writer formats.
 * `row` counts data records from 1; `line` is the physical line where the record starts.
 * Whole-file findings (totals, header, groups) leave out what does not apply.
 * `value` is already masked when the column is sensitive.
 */
export interface Finding {
  readonly rule: string;
  readonly level: Level;
  readonly row?: number;
  readonly line?: number;
  readonly column?: string;
  readonly value?: string;
  readonly expected?: string;
  readonly message: string;
}

/** The exact tally of one check over the whole delivery, kept even when findings are cut. */
export interface CheckTally {
  readonly rule: string;
  readonly level: Level;
  readonly failed: number;
  /** One line saying what the check demands, e.g. "discount at most 0.6". */
  readonly description: string;
  /** Where the contract declared the check. */
  readonly source?: SourcePos;
  /** The share of rows allowed to fail before the check counts against the verdict. */
  readonly allow?: number;
  /** failed / rows, present when `allow` is set. */
  readonly share?: number;
  /** True when the failures stay within `allow` and so do not count against the verdict. */
  readonly within_allowance?: boolean;
  /** The first few findings of this check, kept even past `--max-findings`; not written to JSON. */
  readonly examples?: readonly Finding[];
  /**
   * Findings of this check at other levels than its own, by level (not in `failed`); not written to
   * JSON, where the findings carry their level and `counts` includes them.
   */
  readonly otherLevels?: Readonly<Partial<Record<Level, number>>>;
}

export interface ReferenceUse {
  readonly table: string;
  readonly version: string;
  readonly sha256: string;
}

export interface Counts {
  readonly error: number;
  readonly warning: number;
  readonly note: number;
  readonly rows_failed: number;
}

/** Per-column summary for people (HTML report). Present only when a writer asked for it. */
export interface ColumnProfile {
  readonly column: string;
  readonly type: string;
  readonly filled: number;
  readonly blank: number;
  /** Distinct non-blank values; `distinct_capped` when counting stopped at the cap. */
  readonly distinct: number;
  readonly distinct_capped: boolean;
  readonly min?: string;
  readonly max?: string;
  /** Equal-width bins over [min, max] for numeric and date columns. */
  readonly histogram?: readonly number[];
}

/** The JSON report of one delivery checked against one contract (SPEC §4). */
export interface DeliveryReport {
  readonly report: 1;
  readonly tool: { readonly name: "tablegate"; readonly version: string };
  readonly contract: { readonly name: string; readonly version?: string; readonly path: string; readonly sha256: string };
  readonly input: {
    readonly path: string;
    readonly sha256: string;
    readonly bytes: number;
    readonly rows: number;
    readonly format: string;
    readonly encoding: string;
    /** How the encoding was decided, when `auto` fell back from UTF-8. */
    readonly note?: string;
  };
  readonly references: readonly ReferenceUse[];
  readonly verdict: "pass" | "fail";
  readonly counts: Counts;
  readonly checks: readonly CheckTally[];
  readonly findings: readonly Finding[];
  readonly truncated: boolean;
  readonly profile?: readonly ColumnProfile[];
  readonly elapsed_ms?: number;
}
