/** The collector: exact counts of every failure, the first findings in file order, and samples per check. */
import { describe, expect, it } from "vitest";
import type { CheckMeta } from "../../src/contract/plan.js";
import { createCollector, SAMPLES_PER_CHECK, type Collector } from "../../src/engine/collector.js";
import type { Finding, Level } from "../../src/report/model.js";

const CHECKS: readonly CheckMeta[] = [
  { rule: "qty.max", level: "error", description: "qty at most 10" },
  { rule: "region.codes", level: "warning", description: "region is a listed code" },
  { rule: "postal_code.postal", level: "error", description: "postal_code is a postal code" },
];

/** Fail a check the way the engine does: count, then build and keep the finding only when asked. */
function failAt(c: Collector, check: number, row: number, level?: Level): boolean {
  const wanted = c.fail(check, row, level);
  if (wanted) c.keep(check, { rule: CHECKS[check]?.rule ?? "", level: level ?? CHECKS[check]?.level ?? "error", row, message: `row ${row}` } satisfies Finding);
  return wanted;
}

describe("collector", () => {
  it("counts exactly past maxFindings and keeps the first findings in order", () => {
    const c = createCollector(CHECKS, 3);
    const wanted = Array.from({ length: 10 }, (_, i) => failAt(c, 0, i + 1));
    expect(c.failed[0]).toBe(10);
    expect(c.levelCounts).toEqual({ error: 10, warning: 0, note: 0 });
    expect(c.findings.map((f) => f.row)).toEqual([1, 2, 3]);
    expect(c.truncated).toBe(true);
    // Findings are built only while either the list or the check's samples have room.
    expect(wanted).toEqual([...Array.from({ length: SAMPLES_PER_CHECK }, () => true), ...Array.from({ length: 10 - SAMPLES_PER_CHECK }, () => false)]);
  });

  it("exactly maxFindings failures is not truncation", () => {
    const c = createCollector(CHECKS, 3);
    for (let r = 1; r <= 3; r++) failAt(c, 0, r);
    expect(c.truncated).toBe(false);
    expect(c.findings).toHaveLength(3);
    failAt(c, 1, 4);
    expect(c.truncated).toBe(true);
    expect(c.findings).toHaveLength(3);
  });

  it("keeps the first samples of every check, even after the finding list is full", () => {
    const c = createCollector(CHECKS, 2);
    const n = SAMPLES_PER_CHECK + 3;
    for (let r = 1; r <= n; r++) failAt(c, 0, r);
    for (let r = 101; r <= 100 + n; r++) failAt(c, 1, r);
    expect(c.findings.map((f) => f.row)).toEqual([1, 2]);
    expect(c.samples[0]?.map((f) => f.row)).toEqual(Array.from({ length: SAMPLES_PER_CHECK }, (_, i) => 1 + i));
    expect(c.samples[1]?.map((f) => f.row)).toEqual(Array.from({ length: SAMPLES_PER_CHECK }, (_, i) => 101 + i));
    expect(c.samples[2]).toEqual([]);
    expect(Array.from(c.failed)).toEqual([n, n, 0]);
    expect(c.levelCounts).toEqual({ error: n, warning: n, note: 0 });
  });

  it("rowsFailed counts distinct rows with an error-level finding only", () => {
    const c = createCollector(CHECKS, 100);
    failAt(c, 0, 1);
    failAt(c, 2, 1); // second error on the same row
    failAt(c, 0, 2);
    failAt(c, 1, 3); // warning check
    failAt(c, 2, 4, "note"); // error check, this miss a note
    failAt(c, 1, 5, "error"); // warning check, this miss raised to error
    failAt(c, 0, 0); // a whole-file finding has no row
    failAt(c, 0, 100_000); // far beyond the first bitmap block
    expect(c.rowsFailed).toBe(4); // rows 1, 2, 5, 100000
  });

  it("a level override is counted at its own level but not in failed[] of a check at another level", () => {
    const c = createCollector(CHECKS, 100);
    failAt(c, 2, 1);
    failAt(c, 2, 2, "note");
    failAt(c, 2, 3, "note");
    failAt(c, 2, 4, "error"); // same as the check's level: an ordinary failure
    expect(c.failed[2]).toBe(2);
    expect(c.levelCounts).toEqual({ error: 2, warning: 0, note: 2 });
    expect(c.rowsFailed).toBe(2);
    expect(c.findings.map((f) => [f.row, f.level])).toEqual([
      [1, "error"],
      [2, "note"],
      [3, "note"],
      [4, "error"],
    ]);
  });

  it("maxFindings 0 keeps no findings but still samples and counts", () => {
    const c = createCollector(CHECKS, 0);
    for (let r = 1; r <= SAMPLES_PER_CHECK + 2; r++) failAt(c, 1, r);
    expect(c.findings).toEqual([]);
    expect(c.samples[1]).toHaveLength(SAMPLES_PER_CHECK);
    expect(c.failed[1]).toBe(SAMPLES_PER_CHECK + 2);
    expect(c.truncated).toBe(true);
  });
});
