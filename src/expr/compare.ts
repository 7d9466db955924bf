/** Ordering of values under SQL comparison rules, with the implicit casts the language allows. */
import type { Value } from "../values.js";
import { textToBoolean, textToNumber } from "./coerce.js";
import { MS_PER_DAY, parseIsoDate, parseIsoTime, parseIsoTimestamp } from "./dates.js";

const order = (a: number | string, b: number | string): number => (a < b ? -1 : a > b ? 1 : 0);

/** Compare a non-null value with a text, casting the text to the value's kind; null when it does not cast. */
function compareWithText(a: Exclude<Value, null>, text: string): number | null {
  if (typeof a === "string") return order(a, text);
  if (typeof a === "number") {
    const n = textToNumber(text);
    return n === null ? null : order(a, n);
  }
  if (typeof a === "boolean") {
    const b = textToBoolean(text);
    return b === null ? null : order(a ? 1 : 0, b ? 1 : 0);
  }
  if (a.kind === "date") {
    const d = parseIsoDate(text);
    return d === null ? null : order(a.days, d);
  }
  if (a.kind === "time") {
    const t = parseIsoTime(text);
    return t === null ? null : order(a.seconds, t);
  }
  const ts = parseIsoTimestamp(text);
  return ts === null ? null : order(a.ms, ts.ms);
}

/**
 * -1, 0 or 1 as SQL orders `a` and `b`; null when either is NULL or the two cannot be compared.
 * Text casts to the other side's kind (as SQL casts a literal); a date meets a timestamp at midnight
 * UTC; FALSE sorts before TRUE; text compares by UTF-16 code unit (binary collation).
 */
export function compareValues(a: Value, b: Value): number | null {
  if (a === null || b === null) return null;
  const ta = typeof a;
  if (ta === "number" && typeof b === "number") return order(a as number, b);
  if (ta === "string") {
    if (typeof b === "string") return order(a as string, b);
    const c = compareWithText(b, a as string);
    return c === null ? null : -c;
  }
  if (typeof b === "string") return compareWithText(a, b);
  if (ta === "boolean") return typeof b === "boolean" ? order(a ? 1 : 0, b ? 1 : 0) : null;
  if (typeof a !== "object" || typeof b !== "object") return null;
  if (a.kind === "date" && b.kind === "date") return order(a.days, b.days);
  if (a.kind === "time" || b.kind === "time") return a.kind === "time" && b.kind === "time" ? order(a.seconds, b.seconds) : null;
  const ma = a.kind === "date" ? a.days * MS_PER_DAY : a.ms;
  const mb = b.kind === "date" ? b.days * MS_PER_DAY : b.ms;
  return order(ma, mb);
}

/**
 * A comparer against one text literal whose casts are worked out once, so a per-row comparison of a
 * date or number column with `'2026-01-31'` or `'12'` parses nothing. Result as compareValues(a, text).
 */
export function textLiteralComparer(text: string): (a: Value) => number | null {
  const asNumber = textToNumber(text);
  const asBoolean = textToBoolean(text);
  const asDate = parseIsoDate(text);
  const asTime = parseIsoTime(text);
  const asTimestamp = parseIsoTimestamp(text)?.ms ?? null;
  return (a) => {
    if (a === null) return null;
    if (typeof a === "string") return order(a, text);
    if (typeof a === "number") return asNumber === null ? null : order(a, asNumber);
    if (typeof a === "boolean") return asBoolean === null ? null : order(a ? 1 : 0, asBoolean ? 1 : 0);
    if (a.kind === "date") return asDate === null ? null : order(a.days, asDate);
    if (a.kind === "time") return asTime === null ? null : order(a.seconds, asTime);
    return asTimestamp === null ? null : order(a.ms, asTimestamp);
  };
}
