import { describe, expect, it } from "vitest";
import { compareReport, leakedValues } from "../../src/demo/compare.js";
import type { DeliveryOutcome } from "../../src/demo/expected.js";

const designed: DeliveryOutcome = {
  file: "x.csv",
  exitCode: 1,
  verdict: "fail",
  rows: 10,
  failures: {
    "qty.type": { failed: 2, rows: [3, 7], planted: "p" },
    "group:g": { failed: 1, planted: "p" },
  },
};

function report(checks: { rule: string; failed: number }[], findings: { rule: string; row?: number }[], over: object = {}): object {
  return { verdict: "fail", input: { rows: 10 }, checks, findings, ...over };
}

describe("compareReport", () => {
  it("accepts the designed outcome, with rows in any order and passing checks ignored", () => {
    const r = report(
      [{ rule: "qty.type", failed: 2 }, { rule: "group:g", failed: 1 }, { rule: "sku.pattern", failed: 0 }],
      [{ rule: "qty.type", row: 7 }, { rule: "qty.type", row: 3 }, { rule: "group:g", row: 1 }],
    );
    expect(compareReport(r, designed)).toEqual([]);
  });

  it("names a missing check, a wrong count, wrong rows and an unexpected check", () => {
    const r = report(
      [{ rule: "qty.type", failed: 3 }, { rule: "sku.spaces", failed: 1 }],
      [{ rule: "qty.type", row: 3 }, { rule: "qty.type", row: 8 }, { rule: "sku.spaces", row: 4 }],
    );
    const diffs = compareReport(r, designed);
    expect(diffs).toHaveLength(4);
    expect(diffs.filter((d) => d.startsWith("group:g:"))).toHaveLength(1);
    expect(diffs.filter((d) => d.startsWith("qty.type:"))).toHaveLength(2);
    expect(diffs.filter((d) => d.startsWith("sku.spaces:"))).toHaveLength(1);
  });

  it("names a wrong verdict and row count, and a report that is not an object", () => {
    const r = report([{ rule: "qty.type", failed: 2 }, { rule: "group:g", failed: 1 }], [{ rule: "qty.type", row: 3 }, { rule: "qty.type", row: 7 }], { verdict: "pass", input: { rows: 9 } });
    expect(compareReport(r, designed)).toHaveLength(2);
    expect(compareReport("oops", designed)).toHaveLength(1);
    expect(compareReport({ verdict: "pass", input: { rows: 10 }, checks: [], findings: [] }, { ...designed, verdict: "pass", failures: {} })).toEqual([]);
  });
});

describe("leakedValues", () => {
  it("returns the raw values found in an output and ignores blanks", () => {
    expect(leakedValues("contact a***@***.org and b@example.org", ["a@example.org", "b@example.org", ""])).toEqual(["b@example.org"]);
  });
});
