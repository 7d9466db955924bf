/**
 * Arithmetic on values: NULL in, NULL out (ISO/IEC 9075). Numbers add, multiply and divide as SQL DECIMAL
 * (see decimal.ts). A date plus or minus a whole number of days is a date; date minus date is days;
 * timestamps shift by (fractional) days and subtract to days; time minus time is days too. Division
 * or remainder by zero gives NULL where SQL raises an error: a data check reports, it does not stop.
 * Text that spells a number is cast to one; any other mix is NULL.
 */
import { dateValue, timestampValue, type Value } from "../values.js";
import { textToNumber } from "./coerce.js";
import { MS_PER_DAY } from "./dates.js";
import { decimalAdd, decimalDiv, decimalMul, decimalSub, scaleOf } from "./decimal.js";

const num = (v: Value): number | null => (typeof v === "number" ? v : typeof v === "string" ? textToNumber(v) : null);

/** a + b */
export function add(a: Value, b: Value): Value {
  if (typeof a === "number" && typeof b === "number") return decimalAdd(a, b);
  if (a === null || b === null) return null;
  if (typeof a === "object") return shift(a, num(b), 1);
  if (typeof b === "object") return shift(b, num(a), 1);
  const x = num(a);
  const y = num(b);
  return x === null || y === null ? null : decimalAdd(x, y);
}

/** a - b */
export function subtract(a: Value, b: Value): Value {
  if (typeof a === "number" && typeof b === "number") return decimalSub(a, b);
  if (a === null || b === null) return null;
  if (typeof a === "object") {
    if (typeof b === "object") {
      if (a.kind === "date" && b.kind === "date") return a.days - b.days;
      if (a.kind === "time" || b.kind === "time") return a.kind === "time" && b.kind === "time" ? (a.seconds - b.seconds) / 86_400 : null;
      const ma = a.kind === "date" ? a.days * MS_PER_DAY : a.ms;
      const mb = b.kind === "date" ? b.days * MS_PER_DAY : b.ms;
      return (ma - mb) / MS_PER_DAY;
    }
    return shift(a, num(b), -1);
  }
  const x = num(a);
  const y = num(b);
  return x === null || y === null ? null : decimalSub(x, y);
}

function shift(a: Exclude<Value, null | string | number | boolean>, days: number | null, sign: 1 | -1): Value {
  if (days === null) return null;
  if (a.kind === "date") return Number.isInteger(days) ? dateValue(a.days + sign * days) : null;
  if (a.kind === "timestamp") return timestampValue(a.ms + Math.round(sign * days * MS_PER_DAY), a.zoned);
  return null;
}

/** a * b */
export function multiply(a: Value, b: Value): Value {
  if (typeof a === "number" && typeof b === "number") return decimalMul(a, b);
  const x = num(a);
  const y = num(b);
  return x === null || y === null ? null : decimalMul(x, y);
}

/** a / b, exact for decimals whose quotient ends (see decimal.ts); NULL when b is zero. */
export function divide(a: Value, b: Value): Value {
  const x = num(a);
  const y = num(b);
  return x === null || y === null || y === 0 ? null : decimalDiv(x, y);
}

/** a % b with the sign of a (as SQL MOD); NULL when b is zero. */
export function remainder(a: Value, b: Value): Value {
  const x = num(a);
  const y = num(b);
  if (x === null || y === null || y === 0) return null;
  if (Number.isInteger(x) && Number.isInteger(y)) return x % y;
  const sx = scaleOf(x);
  const sy = scaleOf(y);
  if (sx < 0 || sy < 0) return x % y;
  // Work on the scaled integers so that 0.3 % 0.1 is 0, as in DECIMAL.
  const p = 10 ** Math.max(sx, sy);
  const ix = Math.round(x * p);
  const iy = Math.round(y * p);
  return Math.abs(ix) < 2 ** 53 && Math.abs(iy) < 2 ** 53 ? (ix % iy) / p : x % y;
}

/** -a */
export function negate(a: Value): Value {
  const x = num(a);
  return x === null ? null : -x;
}
