import { describe, expect, it } from "vitest";
import { median as ssMedian, medianAbsoluteDeviation as ssMad } from "simple-statistics";
import { createFloatColumn, findOutliers, madScores, MEAN_AD_CONSTANT } from "../../src/stats/index.js";
import { checkJson } from "../helpers/cli.js";

const f64 = (xs: number[]): Float64Array => Float64Array.from(xs);
const column = (xs: number[]) => {
  const col = createFloatColumn(2);
  xs.forEach((x, i) => col.push(x, i + 1));
  return col;
};

// Modified z-score M = 0.6745·(x − median)/MAD, flag |M| > 3.5 (Iglewicz & Hoaglin 1993, as cited by the
// NIST/SEMATECH e-Handbook §1.3.5.17). Worked example from reference-facts.md:
// [2,4,4,5,6,7,8,30] → median 5.5, MAD 1.5, M(30) = 11.0168.
const SAMPLE = [2, 4, 4, 5, 6, 7, 8, 30];

describe("madScores", () => {
  it("gives median 5.5, MAD 1.5 and M(30) = 11.0168 for the reference sample", () => {
    const s = madScores(f64(SAMPLE));
    expect(s).toBeDefined();
    expect(s?.median).toBe(5.5);
    expect(s?.mad).toBe(1.5);
    expect(s?.basis).toBe("mad");
    expect(s?.score(30)).toBeCloseTo(11.0168, 4);
    expect(s?.score(5.5)).toBe(0);
    expect(s?.score(2)).toBeCloseTo((0.6745 * (2 - 5.5)) / 1.5, 12);
  });

  it("is undefined for an empty column", () => {
    expect(madScores(f64([]))).toBeUndefined();
  });

  it("treats a single value as constant: score 0 for it, ±Infinity for anything else", () => {
    const s = madScores(f64([4]));
    expect(s?.basis).toBe("constant");
    expect(s?.median).toBe(4);
    expect(s?.mad).toBe(0);
    expect(s?.score(4)).toBe(0);
    expect(s?.score(5)).toBe(Infinity);
    expect(s?.score(3)).toBe(-Infinity);
  });

  it("falls back to 1.253314 × the mean absolute deviation from the median when MAD is 0", () => {
    // five of eight values tie at 0 → MAD 0; deviations from median 0 sum to 1 + 2 + 40 = 43
    const s = madScores(f64([0, 0, 0, 0, 0, 1, 2, 40]));
    expect(s?.basis).toBe("mean-ad");
    expect(s?.median).toBe(0);
    expect(s?.mad).toBe(0);
    expect(s?.meanAd).toBe(43 / 8);
    expect(s?.score(40)).toBeCloseTo(40 / (1.253314 * (43 / 8)), 12);
    expect(s?.score(0)).toBe(0);
  });

  // √(π/2) = σ / E|X − μ| for a normal distribution (E|X − μ| = σ·√(2/π), a textbook identity).
  it("uses √(π/2) to six decimals as the mean-deviation constant", () => {
    expect(MEAN_AD_CONSTANT).toBeCloseTo(Math.sqrt(Math.PI / 2), 6);
  });

  // Cross-check median and unscaled MAD against simple-statistics 7.12.1 (reference-facts.md notes its
  // medianAbsoluteDeviation is unscaled).
  it("agrees with simple-statistics median and medianAbsoluteDeviation", () => {
    let seed = 7;
    const rand = (): number => {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      return seed / 2147483648;
    };
    for (const n of [1, 2, 3, 8, 51, 400]) {
      const xs = Array.from({ length: n }, () => Math.round(rand() * 10000) / 100);
      const s = madScores(f64(xs));
      expect(s?.median).toBeCloseTo(ssMedian(xs), 10);
      expect(s?.mad).toBeCloseTo(ssMad(xs), 10);
    }
  });
});

describe("findOutliers, method mad", () => {
  it("flags 30 in the reference sample with its score, at the default threshold 3.5", () => {
    const r = findOutliers(column(SAMPLE), { method: "mad" });
    expect(r.threshold).toBe(3.5);
    expect(r.median).toBe(5.5);
    expect(r.mad).toBe(1.5);
    expect(r.count).toBe(1);
    expect(r.outliers).toHaveLength(1);
    expect(r.outliers[0]?.row).toBe(8);
    expect(r.outliers[0]?.value).toBe(30);
    expect(r.outliers[0]?.score).toBeCloseTo(11.0168, 4);
  });

  it("flags strictly above the threshold only", () => {
    // M(2) = 0.6745·(−3.5)/1.5 ≈ −1.574: flagged at threshold 1.5, not at 1.6
    expect(findOutliers(column(SAMPLE), { method: "mad", threshold: 1.5 }).outliers.map((o) => o.value)).toEqual([2, 30]);
    expect(findOutliers(column(SAMPLE), { method: "mad", threshold: 1.6 }).outliers.map((o) => o.value)).toEqual([30]);
    expect(findOutliers(column(SAMPLE), { method: "mad", threshold: 12 }).count).toBe(0);
  });

  it("when MAD is 0, flags values far from the median via the mean-deviation fallback", () => {
    // 18 zeros, 1 and 2 close by, 500 far off: MeanAD = 503/21, M(500) ≈ 16.66, M(2) ≈ 0.067
    const xs = [...Array.from({ length: 18 }, () => 0), 1, 2, 500];
    const r = findOutliers(column(xs), { method: "mad" });
    expect(r.basis).toBe("mean-ad");
    expect(r.mad).toBe(0);
    expect(r.count).toBe(1);
    expect(r.outliers[0]?.row).toBe(21);
    expect(r.outliers[0]?.score).toBeCloseTo(500 / (1.253314 * (503 / 21)), 10);
  });

  it("flags nothing when every value is equal", () => {
    const r = findOutliers(column([3, 3, 3, 3]), { method: "mad" });
    expect(r.basis).toBe("constant");
    expect(r.count).toBe(0);
  });

  it("handles empty and single-value columns", () => {
    const empty = findOutliers(column([]), { method: "mad" });
    expect(empty.n).toBe(0);
    expect(empty.count).toBe(0);
    expect(empty.median).toBeUndefined();
    const single = findOutliers(column([9]), { method: "mad" });
    expect(single.n).toBe(1);
    expect(single.count).toBe(0);
    expect(single.median).toBe(9);
  });

  it("never drops rows: the column still holds every value after the search", () => {
    const col = column(SAMPLE);
    findOutliers(col, { method: "mad" });
    findOutliers(col, { method: "tukey" });
    expect(Array.from(col.values())).toEqual(SAMPLE);
  });
});

describe("modified z-scores of a decimal column are compared exactly", () => {
  // Median 1.0, absolute deviations 0.1 0 0 0.1 0.1 0.3 0.1 0.3 0 → MAD 0.1; M(1.3) = 0.6745 × 0.3 / 0.1
  // = 2.0235 in decimal arithmetic (2.0235000000000003 in doubles).
  const values = [0.9, 1.0, 1.0, 1.1, 0.9, 1.3, 1.1, 0.7, 1.0];

  it("a score equal to the threshold is not beyond it; a lower threshold flags both 0.7 and 1.3", () => {
    expect(findOutliers(column(values), { method: "mad", threshold: 2.0235 }).count).toBe(0);
    const report = findOutliers(column(values), { method: "mad", threshold: 2.0234 });
    expect(report.outliers.map((o) => o.value)).toEqual([1.3, 0.7]);
  });
});

describe("the scale a MAD finding was judged on", () => {
  // README "Outliers": when more than half the values are equal the MAD is 0 and the mean absolute
  // deviation scales the score instead; the finding's `expected` says which.
  it("is named in the finding", async () => {
    const contract = "tablegate: 1\nname: m\ncolumns:\n  x: { type: decimal }\noutliers:\n  - { column: x, method: mad }\n";
    const zeros = await checkJson(contract, `x\n${"0\n".repeat(9)}100\n`);
    const spread = await checkJson(contract, "x\n2\n4\n4\n5\n6\n7\n8\n30\n");
    const outliers = (r: typeof zeros) => r.report.findings.filter((f) => f.rule === "outlier:x");
    expect(outliers(zeros).map((f) => [f.row, /mean absolute deviation/.test(f.expected ?? "")])).toEqual([[10, true]]);
    expect(outliers(spread).map((f) => [f.row, /mean absolute deviation/.test(f.expected ?? ""), /the MAD\b/.test(f.expected ?? "")])).toEqual([[8, false, true]]);
  });
});
