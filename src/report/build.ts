import type { Plan } from "../contract/plan.js";
import type { Collector } from "../engine/collector.js";
import type { CheckTally, DeliveryReport, Level } from "./model.js";

export const TOOL_VERSION = "0.1.0";

export interface BuildInput {
  readonly plan: Plan;
  readonly collector: Collector;
  readonly rows: number;
  /** Paths as they should appear in reports: relative to the repository root, '/' separated. */
  readonly contractPath: string;
  readonly input: DeliveryReport["input"];
  /** The lowest level that fails the run: error (default) or warning. */
  readonly failOn: Level;
}

const SEVERITY: Readonly<Record<Level, number>> = { note: 0, warning: 1, error: 2 };

/** Assemble the report of one delivery from the plan and what the engine collected. */
export function buildReport({ plan, collector, rows, contractPath, input, failOn }: BuildInput): DeliveryReport {
  const checks: CheckTally[] = plan.checks.map((meta, i) => {
    const failed = collector.failed[i] ?? 0;
    const other = collector.relevelled.get(i);
    const examples = collector.samples[i] ?? [];
    const base = { ...meta, failed, examples, ...(other === undefined ? {} : { otherLevels: other }) };
    if (meta.allow === undefined) return base;
    // The share of rows that fail the check: for a group, the rows of its failing groups.
    const share = rows === 0 ? 0 : (collector.covered.get(i) ?? failed) / rows;
    return { ...base, share, within_allowance: share <= meta.allow };
  });
  const failing = checks.some((c) => c.failed > 0 && c.within_allowance !== true && SEVERITY[c.level] >= SEVERITY[failOn]);
  const notes = collector.levelCounts;
  return {
    report: 1,
    tool: { name: "tablegate", version: TOOL_VERSION },
    contract: { name: plan.name, ...(plan.version === undefined ? {} : { version: plan.version }), path: contractPath, sha256: plan.sha256 },
    input,
    references: plan.references,
    verdict: failing ? "fail" : "pass",
    counts: { error: notes.error, warning: notes.warning, note: notes.note, rows_failed: collector.rowsFailed },
    checks,
    findings: collector.findings,
    truncated: collector.truncated,
  };
}
