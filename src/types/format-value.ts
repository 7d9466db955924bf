import { civilFromDays, MS_PER_DAY } from "./calendar.js";
import type { Value } from "../values.js";

const pad2 = (n: number): string => (n < 10 ? `0${n}` : String(n));

/** ISO 8601 calendar date; years outside 0000-9999 use the expanded ±YYYYYY form. */
export function formatDays(days: number): string {
  const { year, month, day } = civilFromDays(days);
  const y = year >= 0 && year <= 9999 ? String(year).padStart(4, "0") : (year < 0 ? "-" : "+") + String(Math.abs(year)).padStart(6, "0");
  return `${y}-${pad2(month)}-${pad2(day)}`;
}

/** hh:mm:ss, with .sss only when the time has a fraction. */
function formatClock(seconds: number): string {
  const whole = Math.floor(seconds);
  const ms = Math.round((seconds - whole) * 1000);
  const text = `${pad2(Math.floor(whole / 3600))}:${pad2(Math.floor(whole / 60) % 60)}:${pad2(whole % 60)}`;
  return ms === 0 ? text : `${text}.${String(ms).padStart(3, "0")}`;
}

/**
 * Render a value for a report: ISO 8601 dates, times and timestamps (zoned ones in UTC with Z,
 * unzoned ones without an offset), the shortest text that round-trips a number, 'true'/'false',
 * and '' for null.
 */
export function formatValue(v: Value): string {
  if (v === null) return "";
  switch (typeof v) {
    case "string":
      return v;
    case "number":
      return Object.is(v, -0) ? "0" : String(v);
    case "boolean":
      return v ? "true" : "false";
  }
  switch (v.kind) {
    case "date":
      return formatDays(v.days);
    case "time":
      return formatClock(v.seconds);
    case "timestamp": {
      const days = Math.floor(v.ms / MS_PER_DAY);
      const clock = formatClock((v.ms - days * MS_PER_DAY) / 1000);
      return `${formatDays(days)}T${clock}${v.zoned ? "Z" : ""}`;
    }
  }
}
