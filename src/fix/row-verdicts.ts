import type { Plan } from "../contract/plan.js";
import type { Finding } from "../report/model.js";

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
 * The records that fail an error-level check of their own (cell checks, width, rules, keys, whole-row
 * duplicates), each with its rules in the order the engine found them, one entry per rule.
 */
export function rejectedRows(findings: readonly Finding[], wholeFile: ReadonlySet<string>): Map<number, string[]> {
  const rows = new Map<number, string[]>();
  for (const f of findings) {
    if (f.level !== "error" || f.row === undefined || f.row <= 0 || wholeFile.has(f.rule)) continue;
    const rules = rows.get(f.row);
    if (rules === undefined) rows.set(f.row, [f.rule]);
    else if (!rules.includes(f.rule)) rules.push(f.rule);
  }
  return rows;
}
