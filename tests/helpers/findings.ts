import { expect } from "vitest";
import type { DeliveryReport, Finding, Level } from "../../src/report/model.js";

/** The parts of a finding tests may assert: codes and positions, never wording. */
export interface FindingShape {
  readonly rule: string;
  readonly level?: Level;
  readonly row?: number | null;
  readonly line?: number | null;
  readonly column?: string | null;
  readonly value?: string | null;
}

const KEYS = ["rule", "level", "row", "line", "column", "value"] as const;

/** True when `f` agrees with every field `want` names; `null` demands the field be absent. */
export function matchesShape(f: Finding, want: FindingShape): boolean {
  for (const k of KEYS) {
    if (!(k in want)) continue;
    const w = want[k];
    const got = f[k];
    if (w === null ? got !== undefined : got !== w) return false;
  }
  return true;
}

/** Assert the report holds exactly one finding with the given rule/row/line/column/level (wording ignored). */
export function expectFinding(report: DeliveryReport, want: FindingShape): Finding {
  const hits = report.findings.filter((f) => matchesShape(f, want));
  const sameRule = report.findings.filter((f) => f.rule === want.rule).map(project);
  expect(hits.length, `one finding like ${JSON.stringify(want)}; same rule: ${JSON.stringify(sameRule)}`).toBe(1);
  return hits[0] as Finding;
}

/** Assert no finding of the report matches `want`. */
export function expectNoFinding(report: DeliveryReport, want: FindingShape): void {
  const hits = report.findings.filter((f) => matchesShape(f, want)).map(project);
  expect(hits, `no finding like ${JSON.stringify(want)}`).toEqual([]);
}

/** The tally of one rule id in `checks`, failing when absent. */
export function checkOf(report: DeliveryReport, rule: string): { readonly level: Level; readonly failed: number } {
  const c = report.checks.find((x) => x.rule === rule);
  expect(c, `a check ${rule}; have ${report.checks.map((x) => x.rule).join(", ")}`).toBeDefined();
  return c as { level: Level; failed: number };
}

/** A finding reduced to the fields tests compare. */
export function project(f: Finding): FindingShape {
  const out: Record<string, unknown> = { rule: f.rule, level: f.level };
  for (const k of ["row", "line", "column", "value"] as const) if (f[k] !== undefined) out[k] = f[k];
  return out as unknown as FindingShape;
}
