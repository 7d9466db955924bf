import { scaleOf } from "../expr/decimal.js";
import { atScale, columnScale } from "./column-scale.js";
import { quantileSorted, sortedCopy } from "./quantile.js";

/** Tukey's fences for one column: quartiles by Hyndman & Fan type 7, fences at Q1 − k·IQR and Q3 + k·IQR. */
export interface TukeyFences {
  readonly q1: number;
  readonly q3: number;
  readonly iqr: number;
  readonly low: number;
  readonly high: number;
}

/**
 * Tukey's fences from already sorted values; undefined when empty. For a column of decimals the
 * quartiles (interpolated in quarters: 2 more decimals), the IQR and the fences (k's decimals more)
 * are exact decimals, so a value on a fence is on it, not a rounding error outside.
 */
export function tukeyFencesSorted(sorted: Float64Array, k: number): TukeyFences | undefined {
  if (sorted.length === 0) return undefined;
  const s = columnScale(sorted);
  const quartile = s < 0 ? -1 : s + 2;
  const fence = quartile < 0 || scaleOf(k) < 0 ? -1 : quartile + scaleOf(k);
  const q1 = atScale(quantileSorted(sorted, 0.25), quartile);
  const q3 = atScale(quantileSorted(sorted, 0.75), quartile);
  const iqr = atScale(q3 - q1, quartile);
  const spread = atScale(k * iqr, fence);
  return { q1, q3, iqr, low: atScale(q1 - spread, fence), high: atScale(q3 + spread, fence) };
}

/** Tukey's fences at multiplier k (1.5 inner, 3 outer); undefined when there are no values. */
export function tukeyFences(values: Float64Array, k: number): TukeyFences | undefined {
  if (values.length === 0) return undefined;
  return tukeyFencesSorted(sortedCopy(values), k);
}

/** True when a value lies strictly outside the fences (a value on a fence is not an outlier). */
export function outsideFences(value: number, fences: TukeyFences): boolean {
  return value < fences.low || value > fences.high;
}
