import type { FloatColumnView } from "./float-column.js";
import { madScores, type MadBasis } from "./mad.js";
import { sortedCopy } from "./quantile.js";
import { outsideFences, tukeyFencesSorted } from "./tukey.js";

export const DEFAULT_TUKEY_K = 1.5;
export const DEFAULT_MAD_THRESHOLD = 3.5;

/** How to look for outliers; k and threshold are assumed finite and ≥ 0 (the contract schema checks). */
export interface OutlierMethod {
  readonly method: "tukey" | "mad";
  /** Tukey fence multiplier, default 1.5. */
  readonly k?: number;
  /** Modified z-score threshold, default 3.5; a value is flagged when |M| > threshold. */
  readonly threshold?: number;
  /** Keep at most this many outliers in `outliers` (the first by row); `count` stays exact. */
  readonly limit?: number;
}

/** One flagged value; `score` is the modified z-score (method mad only). */
export interface Outlier {
  readonly row: number;
  readonly value: number;
  readonly score?: number;
}

/** What an outlier search found over one column; rows are flagged, never removed. */
export interface OutlierReport {
  readonly method: "tukey" | "mad";
  /** Number of values examined. */
  readonly n: number;
  /** Number of outliers, exact even when `outliers` was cut by `limit`. */
  readonly count: number;
  /** Outliers in ascending row order. */
  readonly outliers: readonly Outlier[];
  // tukey
  readonly k?: number;
  readonly q1?: number;
  readonly q3?: number;
  readonly iqr?: number;
  readonly fence?: { readonly low: number; readonly high: number };
  // mad
  readonly threshold?: number;
  readonly median?: number;
  readonly mad?: number;
  readonly meanAd?: number;
  readonly basis?: MadBasis;
}

/** Flags the values of a column that lie outside Tukey's fences or past a modified z-score threshold. */
export function findOutliers(column: FloatColumnView, spec: OutlierMethod): OutlierReport {
  const values = column.values();
  const rows = column.rows();
  const limit = spec.limit ?? Infinity;
  const n = values.length;

  // Engines push rows in order; if not, collect everything and sort before cutting to the limit.
  let monotonic = true;
  for (let i = 1; i < n && monotonic; i++) monotonic = (rows[i - 1] as number) <= (rows[i] as number);
  const keep = monotonic ? limit : Infinity;

  const outliers: Outlier[] = [];
  let count = 0;
  let report: Omit<OutlierReport, "count" | "outliers">;

  if (spec.method === "tukey") {
    const k = spec.k ?? DEFAULT_TUKEY_K;
    const fences = tukeyFencesSorted(sortedCopy(values), k);
    report = fences
      ? { method: "tukey", n, k, q1: fences.q1, q3: fences.q3, iqr: fences.iqr, fence: { low: fences.low, high: fences.high } }
      : { method: "tukey", n, k };
    if (fences) {
      for (let i = 0; i < n; i++) {
        const value = values[i] as number;
        if (!outsideFences(value, fences)) continue;
        count++;
        if (outliers.length < keep) outliers.push({ row: rows[i] as number, value });
      }
    }
  } else {
    const threshold = spec.threshold ?? DEFAULT_MAD_THRESHOLD;
    const scale = madScores(values);
    report = scale
      ? { method: "mad", n, threshold, median: scale.median, mad: scale.mad, meanAd: scale.meanAd, basis: scale.basis }
      : { method: "mad", n, threshold };
    if (scale) {
      const beyond = scale.beyondFor(threshold);
      for (let i = 0; i < n; i++) {
        const value = values[i] as number;
        if (!beyond(value)) continue;
        const score = scale.score(value);
        count++;
        if (outliers.length < keep) outliers.push({ row: rows[i] as number, value, score });
      }
    }
  }

  if (!monotonic) {
    outliers.sort((a, b) => a.row - b.row);
    if (outliers.length > limit) outliers.length = limit;
  }
  return { ...report, count, outliers };
}
