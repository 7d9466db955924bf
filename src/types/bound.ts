import type { ColumnSpec } from "../contract/types.js";
import { dateValue, timestampValue, timeValue, type Value } from "../values.js";
import { MS_PER_DAY } from "./calendar.js";
import { parseIsoDate, parseIsoTime, parseIsoTimestamp } from "./iso.js";

/**
 * Parse a `min`/`max` written in the contract, whatever the column's delivery formats: a finite
 * number for integer/decimal; ISO 8601 text for date (YYYY-MM-DD), timestamp (RFC 3339, or a bare
 * YYYY-MM-DD meaning its midnight UTC) and time (hh:mm[:ss]). Undefined when it does not fit.
 */
export function parseBound(spec: ColumnSpec, bound: number | string): Value | undefined {
  switch (spec.type) {
    case "integer":
    case "decimal":
      return typeof bound === "number" && Number.isFinite(bound) ? bound : undefined;
    case "date": {
      const days = typeof bound === "string" ? parseIsoDate(bound.trim()) : undefined;
      return days === undefined ? undefined : dateValue(days);
    }
    case "timestamp": {
      if (typeof bound !== "string") return undefined;
      const text = bound.trim();
      const days = parseIsoDate(text);
      // A bare date bound is midnight UTC (README), shown as such: with Z.
      return days === undefined ? parseIsoTimestamp(text) : timestampValue(days * MS_PER_DAY, true);
    }
    case "time": {
      const seconds = typeof bound === "string" ? parseIsoTime(bound.trim()) : undefined;
      return seconds === undefined ? undefined : timeValue(seconds);
    }
    default:
      return undefined;
  }
}
