import type { CheckMeta } from "../contract/plan.js";
import type { Finding, Level } from "../report/model.js";
import { createRowBits } from "./growable.js";

/** How many findings of each check are kept for people even past `--max-findings`. */
export const SAMPLES_PER_CHECK = 5;

/**
 * Counts every failure exactly and keeps the first `maxFindings` findings in file order, plus the
 * first few of each check so a person sees an example of every rule.
 */
export interface Collector {
  /**
   * Count a failure of `check` on `row` (0 for whole-file findings); true when the caller should
   * build the finding and pass it to `keep`. `level` overrides the check's level for this one.
   */
  fail(check: number, row: number, level?: Level): boolean;
  keep(check: number, finding: Finding): void;
  /** Count `rows` rows as failing `check` for its allowance, where a finding stands for many (a group's rows). */
  cover(check: number, rows: number): void;
  /** Rows that failed each check that covers rows (groups); other checks' rows are their failures. */
  readonly covered: ReadonlyMap<number, number>;
  /** Failures reported at another level than their check's (a postal code no layout can judge: a note). */
  readonly relevelled: ReadonlyMap<number, Readonly<Partial<Record<Level, number>>>>;
  readonly failed: Uint32Array;
  readonly findings: readonly Finding[];
  /** Findings by check, the first SAMPLES_PER_CHECK of each level of each. */
  readonly samples: readonly (readonly Finding[])[];
  readonly levelCounts: Readonly<Record<Level, number>>;
  /** Rows with at least one error-level finding. */
  readonly rowsFailed: number;
  readonly truncated: boolean;
}

export function createCollector(checks: readonly CheckMeta[], maxFindings: number): Collector {
  const failed = new Uint32Array(checks.length);
  const findings: Finding[] = [];
  const samples: Finding[][] = checks.map(() => []);
  const levelCounts: Record<Level, number> = { error: 0, warning: 0, note: 0 };
  const failedRows = createRowBits();
  const covered = new Map<number, number>();
  const relevelled = new Map<number, Partial<Record<Level, number>>>();
  let truncated = false;
  // Examples are kept per check and level, so a few notes cannot crowd out a check's errors.
  const sampled = (check: number, level: Level): number => {
    let n = 0;
    for (const f of samples[check] ?? []) if (f.level === level) n++;
    return n;
  };
  return {
    fail(check, row, level) {
      const meta = checks[check];
      const lvl = level ?? meta?.level ?? "error";
      levelCounts[lvl]++;
      const own = level === undefined || level === meta?.level;
      if (own) failed[check] = (failed[check] ?? 0) + 1;
      else {
        const other = relevelled.get(check) ?? {};
        other[lvl] = (other[lvl] ?? 0) + 1;
        relevelled.set(check, other);
      }
      if (lvl === "error" && row > 0) failedRows.set(row);
      const wanted = findings.length < maxFindings || sampled(check, lvl) < SAMPLES_PER_CHECK;
      if (findings.length >= maxFindings) truncated = true;
      return wanted;
    },
    keep(check, finding) {
      if (findings.length < maxFindings) findings.push(finding);
      if (sampled(check, finding.level) < SAMPLES_PER_CHECK) samples[check]?.push(finding);
    },
    cover(check, rows) {
      covered.set(check, (covered.get(check) ?? 0) + rows);
    },
    covered,
    relevelled,
    failed,
    findings,
    samples,
    levelCounts,
    get rowsFailed() {
      return failedRows.count;
    },
    get truncated() {
      return truncated;
    },
  };
}
