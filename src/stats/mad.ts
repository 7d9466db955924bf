import { medianSorted, sortedCopy } from "./quantile.js";

/**
 * 0.6745 as published with the modified z-score (Iglewicz & Hoaglin 1993, as cited by the NIST/SEMATECH
 * e-Handbook §1.3.5.17); it is Φ⁻¹(0.75) rounded, so MAD / 0.6745 estimates σ for normal data.
 */
export const MAD_CONSTANT = 0.6745;

/**
 * σ / E|X − μ| for a normal distribution, √(π/2) ≈ 1.253314: scales the mean absolute deviation to
 * estimate σ when MAD is 0. The fallback M = (x − median) / (1.253314 · MeanAD) is how some statistics
 * software documents the MAD = 0 case (IBM documentation of the modified z-score, from memory).
 */
export const MEAN_AD_CONSTANT = 1.253314;

/** Which spread the scores divide by: MAD, the mean absolute deviation (MAD is 0), or none (all values equal). */
export type MadBasis = "mad" | "mean-ad" | "constant";

/** Modified z-scores of one column, exact: median, MAD and a scorer for any value. */
export interface MadScale {
  readonly median: number;
  /** Median absolute deviation from the median, unscaled. */
  readonly mad: number;
  /** Mean absolute deviation from the median; used only when `mad` is 0. */
  readonly meanAd: number;
  readonly basis: MadBasis;
  /**
   * The modified z-score of x: 0.6745·(x − median)/MAD; when MAD is 0, (x − median)/(1.253314·MeanAD);
   * when every value is equal, 0 for that value and ±Infinity for any other.
   */
  score(x: number): number;
}

/** Median, MAD and a modified z-score function for the values; undefined when there are none. */
export function madScores(values: Float64Array): MadScale | undefined {
  const n = values.length;
  if (n === 0) return undefined;
  // one scratch buffer: sorted values, then overwritten in place by the absolute deviations
  const scratch = sortedCopy(values);
  const median = medianSorted(scratch);
  let sum = 0;
  for (let i = 0; i < n; i++) {
    const d = Math.abs((scratch[i] as number) - median);
    scratch[i] = d;
    sum += d;
  }
  scratch.sort();
  const mad = medianSorted(scratch);
  const meanAd = sum / n;

  if (mad > 0) {
    const factor = MAD_CONSTANT / mad;
    return { median, mad, meanAd, basis: "mad", score: (x) => (x - median) * factor };
  }
  if (meanAd > 0) {
    const divisor = MEAN_AD_CONSTANT * meanAd;
    return { median, mad, meanAd, basis: "mean-ad", score: (x) => (x - median) / divisor };
  }
  return {
    median,
    mad,
    meanAd,
    basis: "constant",
    score: (x) => (x === median ? 0 : x > median ? Infinity : -Infinity),
  };
}
