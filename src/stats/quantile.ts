/**
 * Hyndman & Fan (1996) type 7 quantile of an ascending-sorted array: linear interpolation between
 * order statistics at h = (n − 1)·p. NaN when the array is empty or p is outside [0, 1].
 */
export function quantileSorted(sorted: Float64Array, p: number): number {
  const n = sorted.length;
  if (n === 0 || !(p >= 0 && p <= 1)) return NaN;
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const below = sorted[lo] as number;
  if (lo + 1 >= n) return below;
  const above = sorted[lo + 1] as number;
  // below + t·(above − below) stays exact when both order statistics are equal
  return below + (h - lo) * (above - below);
}

/** An ascending-sorted copy; typed-array sort compares numerically, unlike Array.prototype.sort. */
export function sortedCopy(values: Float64Array): Float64Array {
  return values.slice().sort();
}

/** The median of an ascending-sorted array (type 7 at p = 0.5, the usual midpoint rule); NaN when empty. */
export function medianSorted(sorted: Float64Array): number {
  return quantileSorted(sorted, 0.5);
}
