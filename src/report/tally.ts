import type { CheckTally, DeliveryReport, Finding, Level } from "./model.js";

const RANK: Readonly<Record<Level, number>> = { error: 0, warning: 1, note: 2 };

/** Sort key of a level: lower is more severe. */
export const levelRank = (level: Level): number => RANK[level];

/**
 * The report's checks, plus a tally for any rule that has findings but no declared check, so every
 * finding belongs to exactly one check in every writer.
 */
export function tallies(report: DeliveryReport): readonly CheckTally[] {
  const known = new Set(report.checks.map((c) => c.rule));
  const extra = new Map<string, { level: Level; failed: number }>();
  for (const f of report.findings) {
    if (known.has(f.rule)) continue;
    const seen = extra.get(f.rule);
    if (seen === undefined) extra.set(f.rule, { level: f.level, failed: 1 });
    else seen.failed += 1;
  }
  if (extra.size === 0) return report.checks;
  const added: CheckTally[] = [...extra].map(([rule, t]) => ({ rule, level: t.level, failed: t.failed, description: rule }));
  return [...report.checks, ...added];
}

/** True when this check's failures count against the verdict at its level. */
export const counts = (c: CheckTally): boolean => c.failed > 0 && c.within_allowance !== true;

/** Findings grouped by rule, in report order. */
export function findingsByRule(report: DeliveryReport): ReadonlyMap<string, readonly Finding[]> {
  const out = new Map<string, Finding[]>();
  for (const f of report.findings) {
    const list = out.get(f.rule);
    if (list === undefined) out.set(f.rule, [f]);
    else list.push(f);
  }
  return out;
}

/**
 * The line a finding is placed at: its record's line, or line 1 (the header line) for whole-file
 * findings, which have no line of their own.
 */
export const findingLine = (f: Finding): number => f.line ?? 1;
