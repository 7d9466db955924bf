import { decimalDiv, scaleOf } from "../expr/decimal.js";
import { atScale, columnScale } from "./column-scale.js";
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
  /**
   * For one threshold, a test true when |score(x)| > threshold, decided without dividing: 0.6745·|x − median| > threshold·MAD
   * (or |x − median| > threshold·1.253314·MeanAD), in exact decimals when the column is decimal, so
   * a score equal to the threshold is not beyond it.
   */
  beyondFor(threshold: number): (x: number) => boolean;
}

/** Median, MAD and a modified z-score function for the values; undefined when there are none. */
export function madScores(values: Float64Array): MadScale | undefined {
  const n = values.length;
  if (n === 0) return undefined;
  // Decimals of the column, its median (a midpoint: one more) and its MAD (a midpoint of those: two more).
  const s = columnScale(values);
  const sMedian = s < 0 ? -1 : s + 1;
  const sMad = s < 0 ? -1 : s + 2;
  // one scratch buffer: sorted values, then overwritten in place by the absolute deviations
  const scratch = sortedCopy(values);
  const median = atScale(medianSorted(scratch), sMedian);
  for (let i = 0; i < n; i++) scratch[i] = atScale(Math.abs((scratch[i] as number) - median), sMedian);
  scratch.sort();
  const mad = atScale(medianSorted(scratch), sMad);
  const deviation = (x: number): number => atScale(Math.abs(x - median), sMedian);
  /**
   * x beyond the threshold when a·|x − median| > c·d, each product at the scale its decimal factors
   * give it. The right side and a's scale are the same for every value, so they are worked out once.
   */
  const beyondWhen = (a: number, c: number, d: number): ((x: number) => boolean) => {
    const sa = scaleOf(a);
    const sc = scaleOf(c);
    const sd = scaleOf(d);
    const right = sc < 0 || sd < 0 ? c * d : atScale(c * d, sc + sd);
    const leftScale = sa < 0 || sMedian < 0 ? -1 : sa + sMedian;
    return (x) => atScale(a * deviation(x), leftScale) > right;
  };

  if (mad > 0) {
    const factor = MAD_CONSTANT / mad;
    return { median, mad, meanAd: meanDeviation(scratch, sMedian), basis: "mad", score: (x) => (x - median) * factor, beyondFor: (t) => beyondWhen(MAD_CONSTANT, t, mad) };
  }
  const meanAd = meanDeviation(scratch, sMedian);
  if (meanAd > 0) {
    const divisor = MEAN_AD_CONSTANT * meanAd;
    const limit = (t: number) => atScale(t * MEAN_AD_CONSTANT, scaleOf(t) < 0 ? -1 : scaleOf(t) + 6);
    return { median, mad, meanAd, basis: "mean-ad", score: (x) => (x - median) / divisor, beyondFor: (t) => beyondWhen(1, limit(t), meanAd) };
  }
  return {
    median,
    mad,
    meanAd,
    basis: "constant",
    score: (x) => (x === median ? 0 : x > median ? Infinity : -Infinity),
    beyondFor: () => (x) => x !== median,
  };
}

/** The mean of the (non-negative) deviations, exact when their sum over n ends as a decimal. */
function meanDeviation(deviations: Float64Array, scale: number): number {
  let sum = 0;
  for (let i = 0; i < deviations.length; i++) sum += deviations[i] as number;
  return decimalDiv(atScale(sum, scale), deviations.length);
}
