import { MS_PER_DAY } from "./calendar.js";

/** A spreadsheet date system (ECMA-376 Part 4 / Office Open XML): serial day numbers from 1900 or 1904. */
export type SerialSystem = "serial-1900" | "serial-1904";

// ECMA-376 Part 4 worked values: 1900 system 25569 = 1970-01-01; 1904 system = 1900 system - 1462.
const EPOCH_1900 = 25_569;
const EPOCH_1904 = EPOCH_1900 - 1462;
const LAST_1900 = 2_958_465; // 9999-12-31
const FICTITIOUS_LEAP_DAY = 60; // the 1900 system counts a 1900-02-29 that never existed

/**
 * Days since 1970-01-01 for a whole serial day number, or undefined outside the system's range
 * (1900: 1..2958465, 1904: 0..2957003) and for the fictitious 1900-02-29 (serial 60).
 */
export function serialToDays(serial: number, system: SerialSystem): number | undefined {
  if (system === "serial-1904") return serial >= 0 && serial <= LAST_1900 - 1462 ? serial - EPOCH_1904 : undefined;
  if (serial < 1 || serial > LAST_1900 || serial === FICTITIOUS_LEAP_DAY) return undefined;
  // serials 1..59 sit before the fictitious day, so they are one day later in the count than real days
  return serial < FICTITIOUS_LEAP_DAY ? serial - EPOCH_1900 + 1 : serial - EPOCH_1900;
}

/** Check unsigned decimal digits with an optional fraction; returns the index of the mark, -1 without one, -2 when not a serial. */
function serialShape(text: string): number {
  let mark = -1;
  let digits = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c >= 48 && c <= 57) {
      if (mark < 0) digits++;
    } else if (c === 46 && mark < 0 && digits > 0 && i < text.length - 1) mark = i;
    else return -2;
  }
  return digits > 0 ? mark : -2;
}

/**
 * Parse a serial written as a date: whole day numbers only ("45292", or "45292.0"); a non-zero
 * fraction is a time of day and so not a date.
 */
export function parseSerialDate(text: string, system: SerialSystem): number | undefined {
  const mark = serialShape(text);
  if (mark === -2) return undefined;
  if (mark >= 0) {
    for (let i = mark + 1; i < text.length; i++) if (text.charCodeAt(i) !== 48) return undefined;
  }
  return serialToDays(Number(mark >= 0 ? text.slice(0, mark) : text), system);
}

/** Parse a serial written as a timestamp: the fraction is the time of day, rounded to the millisecond. */
export function parseSerialTimestamp(text: string, system: SerialSystem): number | undefined {
  if (serialShape(text) === -2) return undefined;
  const serial = Number(text);
  const whole = Math.floor(serial);
  const days = serialToDays(whole, system);
  if (days === undefined) return undefined;
  return days * MS_PER_DAY + Math.round((serial - whole) * MS_PER_DAY);
}
