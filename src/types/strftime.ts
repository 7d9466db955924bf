import { checkedDays, daysFromCivil, isLeapYear, MS_PER_DAY } from "./calendar.js";
import { leapSecondAllowed } from "./leap-second.js";
import { dateValue, timestampValue, timeValue, type Value } from "../values.js";

/** What a compiled pattern produces: a date, a timestamp (date and time, optional %z), or a time of day. */
export type PatternKind = "date" | "timestamp" | "time";

// Field slots in the scratch array a scan fills.
const YEAR = 0;
const YEAR2 = 1;
const MONTH = 2;
const DAY = 3;
const YDAY = 4;
const HOUR = 5;
const MINUTE = 6;
const SECOND = 7;
const OFFSET = 8;
const FIELD_COUNT = 9;

type Token =
  | { readonly t: "lit"; readonly s: string }
  | { readonly t: "num"; readonly field: number; min: number; readonly max: number; readonly space: boolean }
  | { readonly t: "month" }
  | { readonly t: "zone" };

interface Directive {
  readonly field: number;
  /** digit count range; 0 for the month-name and offset directives */
  readonly digits: readonly [number, number];
  readonly group: "date" | "time" | "zone";
  readonly space?: boolean;
}

// POSIX strptime: "leading zeros are permitted but not required" for %m %d %e %j %y %H %M %S;
// %e equals %d and may be padded with a space. %Y is held to four digits (ISO 8601 years 0000-9999).
const DIRECTIVES: Readonly<Record<string, Directive>> = {
  Y: { field: YEAR, digits: [4, 4], group: "date" },
  y: { field: YEAR2, digits: [1, 2], group: "date" },
  m: { field: MONTH, digits: [1, 2], group: "date" },
  b: { field: MONTH, digits: [0, 0], group: "date" },
  B: { field: MONTH, digits: [0, 0], group: "date" },
  d: { field: DAY, digits: [1, 2], group: "date" },
  e: { field: DAY, digits: [1, 2], group: "date", space: true },
  j: { field: YDAY, digits: [1, 3], group: "date" },
  H: { field: HOUR, digits: [1, 2], group: "time" },
  M: { field: MINUTE, digits: [1, 2], group: "time" },
  S: { field: SECOND, digits: [1, 2], group: "time" },
  z: { field: OFFSET, digits: [0, 0], group: "zone" },
};

const SUPPORTED: Readonly<Record<PatternKind, string>> = {
  date: "%Y %y %m %d %e %j %b %B %%",
  timestamp: "%Y %y %m %d %e %j %b %B %H %M %S %z %%",
  time: "%H %M %S %%",
};

const MONTHS = ["january", "february", "march", "april", "may", "june", "july", "august", "september", "october", "november", "december"] as const;

/** A compiled pattern: parse trimmed text, or undefined when it does not fit. */
export type PatternParser = (text: string) => Value | undefined;

/** Compile a strftime pattern once; the message lists the supported directives when one is unknown. */
export function compileStrftime(
  pattern: string,
  kind: PatternKind,
  /** other format names the column accepts, named in the unknown-directive message */
  names: readonly string[] = [],
): { ok: true; parse: PatternParser; zoned: boolean } | { ok: false; message: string; offset?: number } {
  const tokens: Token[] = [];
  const seen: (string | undefined)[] = new Array<string | undefined>(FIELD_COUNT).fill(undefined);
  let literal = "";
  for (let i = 0; i < pattern.length; i++) {
    const ch = pattern[i] ?? "";
    if (ch !== "%") {
      literal += ch;
      continue;
    }
    const name = pattern[i + 1];
    i++;
    if (name === undefined) return { ok: false, message: `the pattern ends with a lone %; write %% for a literal %`, offset: i - 1 };
    if (name === "%") {
      literal += "%";
      continue;
    }
    const d = DIRECTIVES[name];
    const allowed = d !== undefined && (kind === "timestamp" || (kind === "date" ? d.group === "date" : d.group === "time"));
    if (!allowed) {
      const others = names.length > 0 ? `, or one of the names ${names.join(", ")}` : "";
      return { ok: false, message: `%${name} is not supported in a ${kind} pattern; supported: ${SUPPORTED[kind]}${others}`, offset: i - 1 };
    }
    const before = seen[d.field];
    if (before !== undefined) {
      return { ok: false, message: `%${before} and %${name} both set the ${FIELD_LABEL[d.field] ?? "field"}`, offset: i - 1 };
    }
    seen[d.field] = name;
    if (literal !== "") tokens.push({ t: "lit", s: literal });
    literal = "";
    if (name === "b" || name === "B") tokens.push({ t: "month" });
    else if (name === "z") tokens.push({ t: "zone" });
    else tokens.push({ t: "num", field: d.field, min: d.digits[0], max: d.digits[1], space: d.space === true });
  }
  if (literal !== "") tokens.push({ t: "lit", s: literal });

  const has = (f: number): boolean => seen[f] !== undefined;
  const missing = missingFields(kind, has);
  if (missing !== undefined) return { ok: false, message: missing };

  // Two number directives side by side ("%Y%m%d") are only unambiguous at full width.
  for (let k = 0; k < tokens.length; k++) {
    const tok = tokens[k];
    if (tok?.t !== "num") continue;
    if (tokens[k - 1]?.t === "num" || tokens[k + 1]?.t === "num") tok.min = tok.max;
  }
  return { ok: true, parse: buildParser(tokens, kind, has), zoned: has(OFFSET) };
}

const FIELD_LABEL: Readonly<Record<number, string>> = {
  [YEAR]: "year", [YEAR2]: "year", [MONTH]: "month", [DAY]: "day", [YDAY]: "day of year",
  [HOUR]: "hour", [MINUTE]: "minute", [SECOND]: "second", [OFFSET]: "offset",
};

function missingFields(kind: PatternKind, has: (f: number) => boolean): string | undefined {
  if (kind !== "time") {
    if (has(YEAR) && has(YEAR2)) return "%Y and %y both set the year";
    if (!has(YEAR) && !has(YEAR2)) return "a date pattern needs a year (%Y or %y)";
    if (has(YDAY)) {
      if (has(MONTH) || has(DAY)) return "%j gives month and day already; combine it with a year only";
    } else if (!has(MONTH) || !has(DAY)) {
      return "a date pattern needs a month (%m or %b) and a day (%d or %e), or a day of year (%j)";
    }
  }
  if (kind !== "date" && (!has(HOUR) || !has(MINUTE))) return `a ${kind} pattern needs an hour (%H) and a minute (%M)`;
  if (!has(MINUTE) && has(SECOND)) return "%S needs %M";
  return undefined;
}

function buildParser(tokens: readonly Token[], kind: PatternKind, has: (f: number) => boolean): PatternParser {
  // One scratch array per compiled pattern: parse is synchronous, so calls never overlap.
  const f = new Int32Array(FIELD_COUNT);
  const fullYear = has(YEAR);
  const byYearDay = has(YDAY);
  const hasSecond = has(SECOND);
  const zoned = has(OFFSET);
  return (text: string): Value | undefined => {
    if (!scan(text, tokens, f)) return undefined;
    if (kind === "time") {
      const hour = f[HOUR] ?? 0;
      const minute = f[MINUTE] ?? 0;
      const second = hasSecond ? (f[SECOND] ?? 0) : 0;
      if (hour > 23 || minute > 59 || second > 59) return undefined;
      return timeValue(hour * 3600 + minute * 60 + second);
    }
    const year = fullYear ? (f[YEAR] ?? 0) : pivotYear(f[YEAR2] ?? 0);
    let days: number | undefined;
    if (byYearDay) {
      const yday = f[YDAY] ?? 0;
      if (yday < 1 || yday > (isLeapYear(year) ? 366 : 365)) return undefined;
      days = daysFromCivil(year, 1, 1) + yday - 1;
    } else {
      days = checkedDays(year, f[MONTH] ?? 0, f[DAY] ?? 0);
      if (days === undefined) return undefined;
    }
    if (kind === "date") return dateValue(days);
    const hour = f[HOUR] ?? 0;
    const minute = f[MINUTE] ?? 0;
    const second = hasSecond ? (f[SECOND] ?? 0) : 0;
    const offset = zoned ? (f[OFFSET] ?? 0) : 0;
    if (hour > 23 || minute > 59 || second > 60) return undefined;
    if (second === 60 && !leapSecondAllowed(hour, minute, offset)) return undefined;
    const ms = days * MS_PER_DAY + ((hour * 60 + minute - offset) * 60 + second) * 1000;
    return timestampValue(ms, zoned);
  };
}

/** POSIX strptime %y: 69-99 are 1969-1999, 00-68 are 2000-2068. */
export function pivotYear(yy: number): number {
  return yy >= 69 ? 1900 + yy : 2000 + yy;
}

function scan(text: string, tokens: readonly Token[], f: Int32Array): boolean {
  const len = text.length;
  let pos = 0;
  for (const tok of tokens) {
    switch (tok.t) {
      case "lit":
        if (!text.startsWith(tok.s, pos)) return false;
        pos += tok.s.length;
        break;
      case "num": {
        let width = 0;
        let max = tok.max;
        if (tok.space && text.charCodeAt(pos) === 32) {
          // %e pads a one-digit day with a space: " 5"
          pos++;
          width = 1;
          max = 1;
        }
        let n = 0;
        let digits = 0;
        while (digits < max && pos < len) {
          const c = text.charCodeAt(pos);
          if (c < 48 || c > 57) break;
          n = n * 10 + (c - 48);
          digits++;
          pos++;
        }
        if (digits === 0 || width + digits < tok.min) return false;
        f[tok.field] = n;
        break;
      }
      case "month": {
        const month = scanMonth(text, pos);
        if (month === 0) return false;
        f[MONTH] = month & 0xff;
        pos += month >> 8;
        break;
      }
      case "zone": {
        const zone = scanOffset(text, pos);
        if (zone < 0) return false;
        f[OFFSET] = offsetMinutes(zone);
        pos = offsetEnd(zone);
        break;
      }
    }
  }
  return pos === len;
}

/** English month name or its three-letter abbreviation, any case: month | length << 8, or 0. */
function scanMonth(text: string, pos: number): number {
  for (let m = 0; m < 12; m++) {
    const name = MONTHS[m] ?? "";
    const full = matchFold(text, pos, name);
    if (full === name.length) return (m + 1) | (full << 8);
    if (full >= 3) return (m + 1) | (3 << 8);
  }
  return 0;
}

/** How many leading characters of `word` (lower case ASCII) match text at pos, ignoring case. */
function matchFold(text: string, pos: number, word: string): number {
  let k = 0;
  while (k < word.length && pos + k < text.length && (text.charCodeAt(pos + k) | 0x20) === word.charCodeAt(k)) k++;
  return k;
}

/**
 * A UTC offset at pos: Z, ±hh, ±hhmm or ±hh:mm (hours 00-23, minutes 00-59). Returns -1, or the
 * offset packed with its end position (read with offsetMinutes / offsetEnd) so a scan allocates nothing.
 */
export function scanOffset(text: string, pos: number): number {
  const c = text.charCodeAt(pos);
  if (c === 90 || c === 122) return pack(0, pos + 1);
  if (c !== 43 && c !== 45) return -1;
  const hours = twoDigits(text, pos + 1);
  if (hours < 0 || hours > 23) return -1;
  let end = pos + 3;
  let minutes = 0;
  if (text.charCodeAt(end) === 58) {
    minutes = twoDigits(text, end + 1);
    end += 3;
  } else if (isDigit(text.charCodeAt(end))) {
    minutes = twoDigits(text, end);
    end += 2;
  }
  if (minutes < 0 || minutes > 59) return -1;
  const total = hours * 60 + minutes;
  return pack(c === 45 ? -total : total, end);
}

const pack = (minutes: number, end: number): number => end * 4096 + minutes + 2048;
/** Offset in minutes east of UTC from a scanOffset result. */
export const offsetMinutes = (packed: number): number => (packed % 4096) - 2048;
/** Position after the offset from a scanOffset result. */
export const offsetEnd = (packed: number): number => Math.floor(packed / 4096);

const isDigit = (c: number): boolean => c >= 48 && c <= 57;

/** Value of two ASCII digits at pos, or -1. */
export function twoDigits(text: string, pos: number): number {
  const a = text.charCodeAt(pos) - 48;
  const b = text.charCodeAt(pos + 1) - 48;
  if (!(a >= 0 && a <= 9 && b >= 0 && b <= 9)) return -1;
  return a * 10 + b;
}
