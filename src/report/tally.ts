import type { CheckTally, DeliveryReport, Finding, Level } from "./model.js";

const RANK: Readonly<Record<Level, number>> = { error: 0, warning: 1, note: 2 };

/** Sort key of a level: lower is more severe. */
export const levelRank = (level: Level): number => RANK[level];

/**
 * The report's checks, plus a tally for any rule that has findings but no declared check, so every
 * finding belongs to exactly one check in every writer. With `byLevel`, a check whose findings come at
 * another level too (a postal code no layout can judge is a note under an error check) becomes one
 * tally per level, each with its own count and examples: writers that group findings under a level
 * heading list each finding under its own level.
 */
export function tallies(report: DeliveryReport, options: { byLevel?: boolean } = {}): readonly CheckTally[] {
  const checks = options.byLevel ? report.checks.flatMap(splitByLevel) : report.checks;
  const known = new Set(report.checks.map((c) => c.rule));
  const extra = new Map<string, { level: Level; failed: number }>();
  for (const f of report.findings) {
    if (known.has(f.rule)) continue;
    const seen = extra.get(f.rule);
    if (seen === undefined) extra.set(f.rule, { level: f.level, failed: 1 });
    else seen.failed += 1;
  }
  if (extra.size === 0) return checks;
  const added: CheckTally[] = [...extra].map(([rule, t]) => ({ rule, level: t.level, failed: t.failed, description: rule }));
  return [...checks, ...added];
}

function splitByLevel(c: CheckTally): CheckTally[] {
  const other = c.otherLevels;
  if (other === undefined) return [c];
  const own: CheckTally = { ...c, ...(c.examples ? { examples: c.examples.filter((f) => f.level === c.level) } : {}) };
  const rest = (Object.keys(RANK) as Level[])
    .filter((l) => l !== c.level && (other[l] ?? 0) > 0)
    .map((l): CheckTally => {
      const { allow: _a, share: _s, within_allowance: _w, otherLevels: _o, ...plain } = c;
      return { ...plain, level: l, failed: other[l] ?? 0, ...(c.examples ? { examples: c.examples.filter((f) => f.level === l) } : {}) };
    });
  return [own, ...rest];
}

/** The key of a tally among tallies split by level. */
export const tallyKey = (rule: string, level: Level): string => `${level} ${rule}`;

/** Findings grouped by rule and level (see `tallyKey`), in report order. */
export function findingsByTally(report: DeliveryReport): ReadonlyMap<string, readonly Finding[]> {
  const out = new Map<string, Finding[]>();
  for (const f of report.findings) {
    const key = tallyKey(f.rule, f.level);
    const list = out.get(key);
    if (list === undefined) out.set(key, [f]);
    else list.push(f);
  }
  return out;
}

/** True when this check's failures count against the verdict at its level. */
export const counts = (c: CheckTally): boolean => c.failed > 0 && c.within_allowance !== true;

/**
 * The line a finding is placed at: its record's line, or line 1 (the header line) for whole-file
 * findings, which have no line of their own.
 */
export const findingLine = (f: Finding): number => f.line ?? 1;
