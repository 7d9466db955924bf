import { quantileSorted, sortedCopy } from "./quantile.js";

/** Tukey's fences for one column: quartiles by Hyndman & Fan type 7, fences at Q1 − k·IQR and Q3 + k·IQR. */
export interface TukeyFences {
  readonly q1: number;
  readonly q3: number;
  readonly iqr: number;
  readonly low: number;
  readonly high: number;
}

/** Tukey's fences from already sorted values; undefined when empty. */
export function tukeyFencesSorted(sorted: Float64Array, k: number): TukeyFences | undefined {
  if (sorted.length === 0) return undefined;
  const q1 = quantileSorted(sorted, 0.25);
  const q3 = quantileSorted(sorted, 0.75);
  const iqr = q3 - q1;
  return { q1, q3, iqr, low: q1 - k * iqr, high: q3 + k * iqr };
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
