/** ISO 8601 calendar arithmetic for expression literals and casts (proleptic Gregorian, years 0000-9999). */

const DAY_MS = 86_400_000;

/** Days since 1970-01-01 of a valid civil date (Hinnant's days_from_civil algorithm). */
export function daysFromCivil(year: number, month: number, day: number): number {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yoe = y - era * 400;
  const mp = (month + 9) % 12;
  const doy = Math.floor((153 * mp + 2) / 5) + day - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146_097 + doe - 719_468;
}

/** Year, month and day of a day count since 1970-01-01 (inverse of daysFromCivil). */
export function civilFromDays(days: number): { year: number; month: number; day: number } {
  const z = days + 719_468;
  const era = Math.floor(z / 146_097);
  const doe = z - era * 146_097;
  const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36_524) - Math.floor(doe / 146_096)) / 365);
  const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100));
  const mp = Math.floor((5 * doy + 2) / 153);
  const day = doy - Math.floor((153 * mp + 2) / 5) + 1;
  const month = mp < 10 ? mp + 3 : mp - 9;
  return { year: era * 400 + yoe + (month <= 2 ? 1 : 0), month, day };
}

function daysInMonth(year: number, month: number): number {
  if (month === 2) return year % 4 === 0 && (year % 100 !== 0 || year % 400 === 0) ? 29 : 28;
  return month === 4 || month === 6 || month === 9 || month === 11 ? 30 : 31;
}

function digits(text: string, from: number, count: number): number {
  let n = 0;
  for (let i = from; i < from + count; i++) {
    const c = text.charCodeAt(i) - 48;
    if (c < 0 || c > 9) return -1;
    n = n * 10 + c;
  }
  return n;
}

function dateAt(text: string, at: number): number | null {
  if (text.length < at + 10 || text.charCodeAt(at + 4) !== 45 || text.charCodeAt(at + 7) !== 45) return null;
  const year = digits(text, at, 4);
  const month = digits(text, at + 5, 2);
  const day = digits(text, at + 8, 2);
  if (year < 0 || month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) return null;
  return daysFromCivil(year, month, day);
}

/** Days since 1970-01-01 of an ISO date `YYYY-MM-DD`, or null when the text is not one (Feb 30 is not). */
export function parseIsoDate(text: string): number | null {
  return text.length === 10 ? dateAt(text, 0) : null;
}

function timeAt(text: string, at: number): { seconds: number; end: number } | null {
  if (text.length < at + 5 || text.charCodeAt(at + 2) !== 58) return null;
  const h = digits(text, at, 2);
  const m = digits(text, at + 3, 2);
  if (h < 0 || h > 23 || m < 0 || m > 59) return null;
  let seconds = h * 3600 + m * 60;
  let end = at + 5;
  if (text.charCodeAt(end) === 58) {
    const s = digits(text, end + 1, 2);
    if (text.length < end + 3 || s < 0 || s > 59) return null;
    seconds += s;
    end += 3;
    if (text.charCodeAt(end) === 46) {
      let scale = 0.1;
      let i = end + 1;
      for (; i < text.length; i++) {
        const c = text.charCodeAt(i) - 48;
        if (c < 0 || c > 9) break;
        seconds += c * scale;
        scale /= 10;
      }
      if (i === end + 1) return null;
      end = i;
    }
  }
  return { seconds, end };
}

/** Seconds since midnight of `HH:MM[:SS[.fff]]`, or null. */
export function parseIsoTime(text: string): number | null {
  const t = timeAt(text, 0);
  return t !== null && t.end === text.length ? t.seconds : null;
}

/** An ISO 8601 timestamp `YYYY-MM-DD[( |T)HH:MM[:SS[.fff]]][Z|±HH:MM]`, or null. A bare date is midnight. */
export function parseIsoTimestamp(text: string): { ms: number; zoned: boolean } | null {
  const days = dateAt(text, 0);
  if (days === null) return null;
  if (text.length === 10) return { ms: days * DAY_MS, zoned: false };
  const sep = text.charCodeAt(10);
  if (sep !== 84 && sep !== 32 && sep !== 116) return null;
  const t = timeAt(text, 11);
  if (t === null) return null;
  let ms = days * DAY_MS + Math.round(t.seconds * 1000);
  if (t.end === text.length) return { ms, zoned: false };
  const z = text.charCodeAt(t.end);
  if ((z === 90 || z === 122) && t.end + 1 === text.length) return { ms, zoned: true };
  if ((z === 43 || z === 45) && text.length === t.end + 6 && text.charCodeAt(t.end + 3) === 58) {
    const oh = digits(text, t.end + 1, 2);
    const om = digits(text, t.end + 4, 2);
    if (oh < 0 || oh > 23 || om < 0 || om > 59) return null;
    const offset = (oh * 60 + om) * 60_000;
    ms += z === 43 ? -offset : offset;
    return { ms, zoned: true };
  }
  return null;
}

const pad = (n: number, w: number): string => String(n).padStart(w, "0");

/** `YYYY-MM-DD` of a day count. */
export function formatIsoDate(days: number): string {
  const { year, month, day } = civilFromDays(days);
  return `${pad(year, 4)}-${pad(month, 2)}-${pad(day, 2)}`;
}

/** `HH:MM:SS` of seconds since midnight (fractions kept when present). */
export function formatIsoTime(seconds: number): string {
  const whole = Math.floor(seconds);
  const frac = seconds - whole;
  const base = `${pad(Math.floor(whole / 3600), 2)}:${pad(Math.floor(whole / 60) % 60, 2)}:${pad(whole % 60, 2)}`;
  return frac > 0 ? base + String(Math.round(frac * 1000) / 1000).slice(1) : base;
}

/** ISO 8601 text of an instant, in UTC (`Z`) when zoned, otherwise without an offset. */
export function formatIsoTimestamp(ms: number, zoned: boolean): string {
  const days = Math.floor(ms / DAY_MS);
  const rest = (ms - days * DAY_MS) / 1000;
  return `${formatIsoDate(days)}T${formatIsoTime(rest)}${zoned ? "Z" : ""}`;
}

/** Milliseconds in a day (no leap seconds, as ISO 8601 timestamps here). */
export const MS_PER_DAY = DAY_MS;
