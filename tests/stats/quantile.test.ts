import { describe, expect, it } from "vitest";
import { quantile as ssQuantile } from "simple-statistics";
import { medianSorted, quantileSorted, sortedCopy } from "../../src/stats/index.js";

const f64 = (xs: number[]): Float64Array => Float64Array.from(xs);

describe("quantileSorted (Hyndman & Fan type 7)", () => {
  // Hyndman & Fan 1996 type 7 on the NIST e-Handbook §7.1.6 style sample (reference-facts.md):
  // [1,3,4,6,7,8,9,11,12,22] → Q1 4.5, Q3 10.5.
  it("gives Q1 4.5 and Q3 10.5 for [1,3,4,6,7,8,9,11,12,22]", () => {
    const sorted = f64([1, 3, 4, 6, 7, 8, 9, 11, 12, 22]);
    expect(quantileSorted(sorted, 0.25)).toBe(4.5);
    expect(quantileSorted(sorted, 0.75)).toBe(10.5);
  });

  it("returns the extremes at p 0 and 1 and the only value of a single-value array", () => {
    const sorted = f64([-2, 0, 5]);
    expect(quantileSorted(sorted, 0)).toBe(-2);
    expect(quantileSorted(sorted, 1)).toBe(5);
    expect(quantileSorted(f64([7]), 0.25)).toBe(7);
    expect(quantileSorted(f64([7]), 0.75)).toBe(7);
  });

  it("is NaN for an empty array or p outside [0, 1]", () => {
    expect(quantileSorted(f64([]), 0.5)).toBeNaN();
    expect(quantileSorted(f64([1, 2]), -0.1)).toBeNaN();
    expect(quantileSorted(f64([1, 2]), 1.1)).toBeNaN();
    expect(quantileSorted(f64([1, 2]), NaN)).toBeNaN();
  });

  it("medianSorted is the usual median (midpoint of the middle pair when n is even)", () => {
    expect(medianSorted(f64([2, 4, 4, 5, 6, 7, 8, 30]))).toBe(5.5);
    expect(medianSorted(f64([1, 9, 10]))).toBe(9);
  });

  it("sortedCopy sorts numerically and leaves the input alone", () => {
    const input = f64([10, 9, 100, -1, 2]);
    expect(Array.from(sortedCopy(input))).toEqual([-1, 2, 9, 10, 100]);
    expect(Array.from(input)).toEqual([10, 9, 100, -1, 2]);
  });

  // Cross-check against simple-statistics 7.12.1, whose quantile is type 7 since 7.8.9
  // (reference-facts.md), on random data of several sizes.
  it("agrees with simple-statistics quantile on random data", () => {
    let seed = 12345;
    const rand = (): number => {
      // mulberry32: a small deterministic generator so failures reproduce
      seed = (seed + 0x6d2b79f5) | 0;
      let t = seed;
      t = Math.imul(t ^ (t >>> 15), t | 1);
      t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
      return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
    };
    for (const n of [1, 2, 3, 4, 5, 10, 37, 200, 1001]) {
      const xs = Array.from({ length: n }, () => Math.round((rand() * 2000 - 1000) * 100) / 100);
      const sorted = sortedCopy(f64(xs));
      for (const p of [0, 0.1, 0.25, 0.5, 0.75, 0.9, 0.99, 1]) {
        expect(quantileSorted(sorted, p)).toBeCloseTo(ssQuantile(xs, p), 9);
      }
    }
  });
});
