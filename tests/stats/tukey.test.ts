import { describe, expect, it } from "vitest";
import { createFloatColumn, findOutliers, tukeyFences } from "../../src/stats/index.js";

const f64 = (xs: number[]): Float64Array => Float64Array.from(xs);
const column = (xs: number[], firstRow = 1) => {
  const col = createFloatColumn(2);
  xs.forEach((x, i) => col.push(x, firstRow + i));
  return col;
};

// Tukey fences Q1 − k·IQR, Q3 + k·IQR (Tukey 1977; NIST/SEMATECH e-Handbook §7.1.6); quartiles by
// Hyndman & Fan type 7: for [1,3,4,6,7,8,9,11,12,22] Q1 4.5, Q3 10.5, so 22 is flagged at k 1.5
// (reference-facts.md; type 6 would give Q1 3.75, Q3 11.25 and not flag 22).
const SAMPLE = [1, 3, 4, 6, 7, 8, 9, 11, 12, 22];

describe("tukeyFences", () => {
  it("computes type 7 quartiles and the inner fences for the reference sample", () => {
    const f = tukeyFences(f64(SAMPLE), 1.5);
    expect(f).toEqual({ q1: 4.5, q3: 10.5, iqr: 6, low: -4.5, high: 19.5 });
  });

  it("puts the outer fences at 3·IQR", () => {
    const f = tukeyFences(f64(SAMPLE), 3);
    expect(f?.low).toBe(-13.5);
    expect(f?.high).toBe(28.5);
  });

  it("does not depend on input order", () => {
    const shuffled = [22, 9, 1, 12, 6, 3, 11, 4, 8, 7];
    expect(tukeyFences(f64(shuffled), 1.5)).toEqual(tukeyFences(f64(SAMPLE), 1.5));
  });

  it("is undefined for an empty column and collapses to the value for a single one", () => {
    expect(tukeyFences(f64([]), 1.5)).toBeUndefined();
    expect(tukeyFences(f64([42]), 1.5)).toEqual({ q1: 42, q3: 42, iqr: 0, low: 42, high: 42 });
  });
});

describe("findOutliers, method tukey", () => {
  it("flags 22 at the default k 1.5 with its row and reports the fence", () => {
    const r = findOutliers(column(SAMPLE), { method: "tukey" });
    expect(r.k).toBe(1.5);
    expect(r.fence).toEqual({ low: -4.5, high: 19.5 });
    expect(r.q1).toBe(4.5);
    expect(r.q3).toBe(10.5);
    expect(r.count).toBe(1);
    expect(r.outliers).toEqual([{ row: 10, value: 22 }]);
    expect(r.n).toBe(10);
  });

  it("flags nothing at the outer fences (k 3) for the same sample", () => {
    const r = findOutliers(column(SAMPLE), { method: "tukey", k: 3 });
    expect(r.count).toBe(0);
    expect(r.outliers).toEqual([]);
  });

  it("flags low and high outliers in row order", () => {
    // 12 values; type 7 by hand: Q1 at h 2.75 = 3.75, Q3 at h 8.25 = 11.25, IQR 7.5, fences −7.5 and 22.5
    const r = findOutliers(column([-50, ...SAMPLE, 100], 5), { method: "tukey" });
    expect(r.fence).toEqual({ low: -7.5, high: 22.5 });
    expect(r.outliers.map((o) => [o.row, o.value])).toEqual([
      [5, -50],
      [16, 100],
    ]);
  });

  it("does not flag a value lying exactly on a fence", () => {
    // sorted [-10,0,0,0,0,10,10,10,10,20]; type 7 by hand: Q1 at h 2.25 = 0, Q3 at h 6.75 = 10, IQR 10;
    // at k 1 the fences are −10 and 20, exactly the two extremes
    const r = findOutliers(column([0, 0, 0, 0, 10, 10, 10, 10, 20, -10]), { method: "tukey", k: 1 });
    expect(r.fence).toEqual({ low: -10, high: 20 });
    expect(r.count).toBe(0);
    const nudged = findOutliers(column([0, 0, 0, 0, 10, 10, 10, 10, 20.5, -10]), { method: "tukey", k: 1 });
    expect(nudged.outliers).toEqual([{ row: 9, value: 20.5 }]);
  });

  it("keeps the exact count when the list is cut by limit, and the first rows", () => {
    const xs = [...Array.from({ length: 20 }, () => 5), 100, -100, 200];
    const r = findOutliers(column(xs), { method: "tukey", limit: 2 });
    expect(r.count).toBe(3);
    expect(r.outliers.map((o) => o.row)).toEqual([21, 22]);
  });

  it("sorts outliers by row even when values were pushed out of row order", () => {
    const col = createFloatColumn();
    const data: Array<[number, number]> = [[100, 9], [1, 1], [2, 2], [3, 3], [2, 4], [1, 5], [-90, 7], [2, 6]];
    for (const [v, row] of data) col.push(v, row);
    const r = findOutliers(col, { method: "tukey", limit: 1 });
    expect(r.count).toBe(2);
    expect(r.outliers).toEqual([{ row: 7, value: -90 }]);
  });

  it("reports no fence and no outliers for an empty column", () => {
    const r = findOutliers(column([]), { method: "tukey" });
    expect(r.n).toBe(0);
    expect(r.count).toBe(0);
    expect(r.fence).toBeUndefined();
  });

  it("never flags the single value of a one-value column", () => {
    const r = findOutliers(column([3.25]), { method: "tukey" });
    expect(r.count).toBe(0);
    expect(r.fence).toEqual({ low: 3.25, high: 3.25 });
  });
});

describe("fences of a decimal column are exact decimals", () => {
  // Type 7 on these nine values: h = 8 × 0.25 = 2 and 6, so Q1 = 0.01 and Q3 = 0.04 (the 3rd and 7th
  // values); IQR 0.03; fences 0.01 − 0.045 = −0.035 and 0.04 + 0.045 = 0.085 (decimal arithmetic).
  // In plain doubles the upper fence is 0.08499999999999999 and the value 0.085 would fall outside it.
  const values = [-0.035, 0, 0.01, 0.02, 0.02, 0.03, 0.04, 0.05, 0.085];

  it("puts the fences at -0.035 and 0.085 exactly", () => {
    expect(tukeyFences(f64(values), 1.5)).toEqual({ q1: 0.01, q3: 0.04, iqr: 0.03, low: -0.035, high: 0.085 });
  });

  it("does not flag values that sit on a fence, and flags one a step beyond", () => {
    expect(findOutliers(column(values), { method: "tukey", k: 1.5 }).count).toBe(0);
    const report = findOutliers(column([...values.slice(0, 8), 0.086]), { method: "tukey", k: 1.5 });
    expect(report.outliers.map((o) => o.value)).toEqual([0.086]);
  });
});
