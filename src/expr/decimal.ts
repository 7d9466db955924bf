/**
 * Decimal-exact arithmetic on JS numbers. Cells hold decimals such as 19.99 as the nearest double; SQL
 * adds and multiplies DECIMAL values exactly, so `qty * unit_price = line_total` must hold for
 * 7 * 19.99 = 139.93 (plain doubles give 139.92999999999998). Each result of + - * is rounded to the
 * scale the exact decimal result has (max of the scales for + -, their sum for *), when both operands
 * are short decimals and the result is within 2^53 at that scale; otherwise the double result stands.
 */

const POW10: readonly number[] = Array.from({ length: 16 }, (_, k) => 10 ** k);
const MAX_SCALE = 15;
const SAFE = 2 ** 53;

/** Digits after the decimal point of the shortest decimal whose nearest double is `v` (0..15), or -1. */
export function scaleOf(v: number): number {
  if (Number.isInteger(v)) return 0;
  if (!Number.isFinite(v)) return -1;
  for (let k = 1; k <= MAX_SCALE; k++) {
    const p = POW10[k] as number;
    if (Math.round(v * p) / p === v) return k;
  }
  return -1;
}

/** `r` snapped to `scale` decimals, when that is safely representable. */
export function snap(r: number, scale: number): number {
  if (scale <= 0 || scale > MAX_SCALE) return r;
  const p = POW10[scale] as number;
  const scaled = r * p;
  return Math.abs(scaled) >= SAFE ? r : Math.round(scaled) / p;
}

/** a + b, exact for decimal operands. */
export function decimalAdd(a: number, b: number): number {
  const r = a + b;
  if (Number.isInteger(a) && Number.isInteger(b)) return r;
  const sa = scaleOf(a);
  const sb = scaleOf(b);
  return sa < 0 || sb < 0 ? r : snap(r, sa > sb ? sa : sb);
}

/** a - b, exact for decimal operands. */
export function decimalSub(a: number, b: number): number {
  return decimalAdd(a, -b);
}

/** a * b, exact for decimal operands whose scales add up to at most 15. */
export function decimalMul(a: number, b: number): number {
  const r = a * b;
  if (Number.isInteger(a) && Number.isInteger(b)) return r;
  const sa = scaleOf(a);
  const sb = scaleOf(b);
  return sa < 0 || sb < 0 ? r : snap(r, sa + sb);
}

/**
 * a / b, exact when the quotient of two decimals ends within 15 decimals (0.15 / 3 = 0.05, as SQL's
 * DECIMAL division gives); a quotient that does not end (1 / 3) stays the double. The shortest scale
 * at which the quotient times `b` gives back `a` exactly is the quotient's own scale.
 */
export function decimalDiv(a: number, b: number): number {
  const r = a / b;
  if (!Number.isFinite(r) || Number.isInteger(r)) return r;
  if (scaleOf(a) < 0 || scaleOf(b) < 0) return r;
  for (let k = 1; k <= MAX_SCALE; k++) {
    const q = snap(r, k);
    if (decimalMul(q, b) === a) return q;
  }
  return r;
}

/**
 * `x` rounded to `digits` decimals (negative: tens, hundreds...), half away from zero, deciding ties on
 * the decimal the number stands for: round(2.675, 2) = 2.68 although the double 2.675 lies just below.
 */
export function roundHalfAway(x: number, digits: number): number {
  if (!Number.isFinite(x)) return x;
  const d = Math.max(-MAX_SCALE, Math.min(MAX_SCALE, Math.trunc(digits)));
  const p = 10 ** Math.abs(d);
  const ax = Math.abs(x);
  let scaled = d >= 0 ? ax * p : ax / p;
  const frac = scaled - Math.floor(scaled);
  if (Math.abs(frac - 0.5) < 1e-6) {
    // Near a tie the double may sit on either side of it: shift the decimal text instead.
    const text = String(ax);
    if (!text.includes("e")) scaled = Number(`${text}e${d}`);
  }
  const whole = Math.floor(scaled + 0.5);
  const r = d >= 0 ? whole / p : whole * p;
  return x < 0 ? -r : r;
}
