import type { Plan } from "../contract/plan.js";
import type { Level } from "../report/model.js";

/**
 * Rules judged on the file as a whole (header, structure, groups, outliers, totals): they never
 * reject one record, since removing records changes what they measure.
 */
export function wholeFileRules(plan: Plan): ReadonlySet<string> {
  const f = plan.file;
  const checks = [f.structure, f.headerMissing, f.headerUnexpected, f.headerOrder, f.headerDuplicate,
    ...plan.groups.map((g) => g.check), ...plan.outliers.map((o) => o.check), ...plan.blankShares.map((b) => b.check),
    ...(plan.totalRows ? [plan.totalRows.check] : [])];
  return new Set(checks.map((c) => plan.checks[c]?.rule ?? ""));
}

/**
 * Collects the records that fail an error-level check of their own (cell checks, width, rules, keys,
 * whole-row duplicates), each with its rules in the order the engine found them, one entry per rule.
 * Fed by the engine's per-failure callback, so memory grows with rejected records, not with findings.
 */
export function createRejections(plan: Plan): { onRowFailure: (check: number, row: number, level: Level) => void; rows: Map<number, string[]> } {
  const wholeFile = wholeFileRules(plan);
  const rows = new Map<number, string[]>();
  return {
    rows,
    onRowFailure(check, row, level) {
      const rule = plan.checks[check]?.rule ?? "";
      if (level !== "error" || row <= 0 || wholeFile.has(rule)) return;
      const rules = rows.get(row);
      if (rules === undefined) rows.set(row, [rule]);
      else if (!rules.includes(rule)) rules.push(rule);
    },
  };
}
