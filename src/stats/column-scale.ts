import { scaleOf, snap } from "../expr/decimal.js";

/**
 * The most decimals any value of the column has (each value as the shortest decimal that gives its
 * double), or -1 when some value is not a short decimal. Statistics built from such a column by
 * halving, quartering and multiplying by decimal constants are decimals too, of a scale known in
 * advance; snapping a result to that scale undoes the binary rounding, so that 0.04 + 1.5 × 0.03 is
 * 0.085 exactly and a value sitting on a fence is seen to sit on it.
 */
export function columnScale(values: Float64Array): number {
  let most = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i] as number;
    if (Number.isInteger(v)) continue;
    const s = scaleOf(v);
    if (s < 0) return -1;
    if (s > most) most = s;
  }
  return most;
}

/** `x` snapped to `scale` decimals; unchanged when the scale is unknown (-1) or too fine to hold. */
export function atScale(x: number, scale: number): number {
  return scale < 0 ? x : snap(x, scale);
}
