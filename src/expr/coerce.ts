/** Implicit casts between values, as SQL applies them to text literals. */
import type { Value } from "../values.js";
import { formatIsoDate, formatIsoTime, formatIsoTimestamp } from "./dates.js";

const NUMERIC_TEXT = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/** The number a text spells in SQL numeric-literal syntax (surrounding spaces allowed), or null. */
export function textToNumber(text: string): number | null {
  const t = text.trim();
  if (!NUMERIC_TEXT.test(t)) return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
}

/** SQL boolean literal text (`true`/`false`, any case, surrounding spaces allowed), or null. */
export function textToBoolean(text: string): boolean | null {
  const t = text.trim().toLowerCase();
  return t === "true" ? true : t === "false" ? false : null;
}

/** The text form of a value, as CAST(x AS text) gives it; NULL stays null. */
export function valueToText(v: Value): string | null {
  if (v === null || typeof v === "string") return v;
  if (typeof v === "number") return String(v);
  if (typeof v === "boolean") return v ? "true" : "false";
  if (v.kind === "date") return formatIsoDate(v.days);
  if (v.kind === "time") return formatIsoTime(v.seconds);
  return formatIsoTimestamp(v.ms, v.zoned);
}

/** A number, or numeric text cast to a number; anything else is null. */
export function valueToNumber(v: Value): number | null {
  if (typeof v === "number") return v;
  if (typeof v === "string") return textToNumber(v);
  return null;
}
