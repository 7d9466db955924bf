import { checkedDays, MS_PER_DAY } from "./calendar.js";
import { leapSecondAllowed } from "./leap-second.js";
import { offsetEnd, offsetMinutes, scanOffset, twoDigits } from "./strftime.js";
import { timestampValue, type TimestampValue } from "../values.js";

/** Days of an ISO 8601 calendar date YYYY-MM-DD starting at pos, or undefined when absent or impossible. */
function isoDateAt(text: string, pos: number): number | undefined {
  const hi = twoDigits(text, pos);
  const lo = twoDigits(text, pos + 2);
  if (hi < 0 || lo < 0 || text.charCodeAt(pos + 4) !== 45 || text.charCodeAt(pos + 7) !== 45) return undefined;
  const month = twoDigits(text, pos + 5);
  const day = twoDigits(text, pos + 8);
  if (month < 0 || day < 0) return undefined;
  return checkedDays(hi * 100 + lo, month, day);
}

/** Strict ISO 8601 extended calendar date, exactly YYYY-MM-DD (contract bounds use this). */
export function parseIsoDate(text: string): number | undefined {
  return text.length === 10 ? isoDateAt(text, 0) : undefined;
}

/**
 * ISO 8601 / RFC 3339 timestamp: YYYY-MM-DD, 'T' (or 't', or one space as RFC 3339 §5.6 permits),
 * hh:mm, optional :ss, optional fraction ('.' or ',') truncated to the millisecond, optional offset
 * Z / ±hh:mm / ±hhmm / ±hh. Without an offset the time is read as UTC and marked unzoned.
 */
export function parseIsoTimestamp(text: string): TimestampValue | undefined {
  const len = text.length;
  if (len < 16) return undefined;
  const days = isoDateAt(text, 0);
  if (days === undefined) return undefined;
  const sep = text.charCodeAt(10);
  if (sep !== 84 && sep !== 116 && sep !== 32) return undefined;
  const hour = twoDigits(text, 11);
  const minute = twoDigits(text, 14);
  if (hour < 0 || minute < 0 || text.charCodeAt(13) !== 58 || hour > 23 || minute > 59) return undefined;
  let pos = 16;
  let second = 0;
  let ms = 0;
  if (text.charCodeAt(pos) === 58) {
    second = twoDigits(text, pos + 1);
    if (second < 0 || second > 60) return undefined;
    pos += 3;
    const mark = text.charCodeAt(pos);
    if (mark === 46 || mark === 44) {
      pos++;
      const start = pos;
      let scale = 100;
      while (pos < len) {
        const c = text.charCodeAt(pos);
        if (c < 48 || c > 57) break;
        // digits beyond the millisecond are checked but dropped (truncation never moves to the next second)
        ms += (c - 48) * scale;
        scale = Math.floor(scale / 10);
        pos++;
      }
      if (pos === start) return undefined;
    }
  }
  let offset = 0;
  let zoned = false;
  if (pos < len) {
    const zone = scanOffset(text, pos);
    if (zone < 0 || offsetEnd(zone) !== len) return undefined;
    offset = offsetMinutes(zone);
    zoned = true;
  }
  if (second === 60 && !leapSecondAllowed(hour, minute, offset)) return undefined;
  return timestampValue(days * MS_PER_DAY + ((hour * 60 + minute - offset) * 60 + second) * 1000 + ms, zoned);
}

/** A time of day h:mm or hh:mm with optional :ss (00:00:00 to 23:59:59), in seconds since midnight. */
export function parseIsoTime(text: string): number | undefined {
  const len = text.length;
  // a one-digit hour ("9:05") is how spreadsheets commonly export times: accept it
  const h = len === 4 || len === 7 ? 1 : 2;
  if (len !== 3 + h && len !== 6 + h) return undefined;
  const hour = h === 1 ? oneDigit(text, 0) : twoDigits(text, 0);
  if (!(hour >= 0 && hour <= 23) || text.charCodeAt(h) !== 58) return undefined;
  const minute = twoDigits(text, h + 1);
  if (minute < 0 || minute > 59) return undefined;
  let second = 0;
  if (len === 6 + h) {
    if (text.charCodeAt(h + 3) !== 58) return undefined;
    second = twoDigits(text, h + 4);
    if (second < 0 || second > 59) return undefined;
  }
  return hour * 3600 + minute * 60 + second;
}

/** The digit at `pos`, or -1 for anything else (":" is 58, one past "9": never hour 10). */
function oneDigit(text: string, pos: number): number {
  const d = text.charCodeAt(pos) - 48;
  return d >= 0 && d <= 9 ? d : -1;
}
