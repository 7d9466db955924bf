/**
 * Dates, times and timestamps for expressions, on the same calendar, ISO 8601 readers and rendering
 * as the column types, so a literal in a rule means what the same text means in a cell. The
 * expression layer speaks `null` for "not a value"; the column types speak `undefined`.
 */
import { civilFromDays, daysFromCivil, MS_PER_DAY } from "../types/calendar.js";
import { formatValue } from "../types/format-value.js";
import { parseIsoDate as isoDate, parseIsoTime as isoTime, parseIsoTimestamp as isoTimestamp } from "../types/iso.js";
import { dateValue, timestampValue, timeValue } from "../values.js";

export { civilFromDays, daysFromCivil, MS_PER_DAY };

/** Days since 1970-01-01 of an ISO date `YYYY-MM-DD`, or null when the text is not one (Feb 30 is not). */
export function parseIsoDate(text: string): number | null {
  return isoDate(text) ?? null;
}

/** Seconds since midnight of `HH:MM[:SS]`, or null. */
export function parseIsoTime(text: string): number | null {
  return isoTime(text) ?? null;
}

/** An RFC 3339 / ISO 8601 timestamp, or a bare ISO date taken as midnight (unzoned); null otherwise. */
export function parseIsoTimestamp(text: string): { ms: number; zoned: boolean } | null {
  const t = isoTimestamp(text);
  if (t !== undefined) return { ms: t.ms, zoned: t.zoned };
  const days = isoDate(text);
  return days === undefined ? null : { ms: days * MS_PER_DAY, zoned: false };
}

/** `YYYY-MM-DD` of a day count. */
export const formatIsoDate = (days: number): string => formatValue(dateValue(days));

/** `HH:MM:SS` of seconds since midnight (milliseconds when present). */
export const formatIsoTime = (seconds: number): string => formatValue(timeValue(seconds));

/** ISO 8601 text of an instant, in UTC (`Z`) when zoned, otherwise without an offset. */
export const formatIsoTimestamp = (ms: number, zoned: boolean): string => formatValue(timestampValue(ms, zoned));
