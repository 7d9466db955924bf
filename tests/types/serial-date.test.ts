import { describe, expect, it } from "vitest";
import { dateValue, timestampValue } from "../../src/values.js";
import { serialToDays } from "../../src/types/serial-date.js";
import { parserFor, utcDays } from "./helpers.js";

describe("spreadsheet serial dates", () => {
  const s1900 = parserFor({ type: "date", format: "serial-1900" });
  const s1904 = parserFor({ type: "date", format: "serial-1904" });

  // Source: ECMA-376 Part 4 (Office Open XML), date representation, 1900 date system worked values.
  it.each([
    ["1", 1900, 1, 1],
    ["59", 1900, 2, 28],
    ["61", 1900, 3, 1],
    ["25569", 1970, 1, 1],
    ["45292", 2024, 1, 1],
    ["2958465", 9999, 12, 31],
  ])("1900 system: %s is %i-%i-%i", (serial, y, m, day) => {
    expect(s1900.parse(serial)).toEqual(dateValue(utcDays(y, m, day)));
  });

  // Source: ECMA-376 Part 4: serial 60 is the fictitious 1900-02-29; no real date, so a type error.
  it("treats serial 60 (the fictitious 1900-02-29) as not a date", () => {
    expect(s1900.parse("60")).toBeUndefined();
  });

  // Source: ECMA-376 Part 4, 1904 date system: 0 = 1904-01-01 and serial1900 = serial1904 + 1462.
  it("1904 system: 0 is 1904-01-01", () => {
    expect(s1904.parse("0")).toEqual(dateValue(utcDays(1904, 1, 1)));
  });
  it.each([0, 1, 100, 23_107, 43_830, 2_957_003])("1904 serial %i equals 1900 serial + 1462", (serial) => {
    expect(s1904.parse(String(serial))).toEqual(s1900.parse(String(serial + 1462)));
    expect(serialToDays(serial, "serial-1904")).toBe(serialToDays(serial + 1462, "serial-1900"));
  });

  it("rejects serials outside each system's range", () => {
    expect(s1900.parse("0")).toBeUndefined();
    expect(s1900.parse("2958466")).toBeUndefined();
    expect(s1904.parse("2957004")).toBeUndefined();
    expect(s1904.parse("-1")).toBeUndefined();
  });

  it("accepts a zero fraction but rejects a time of day in a date column", () => {
    expect(s1900.parse("45292.0")).toEqual(dateValue(utcDays(2024, 1, 1)));
    expect(s1900.parse("45292.000")).toEqual(dateValue(utcDays(2024, 1, 1)));
    expect(s1900.parse("45292.5")).toBeUndefined();
  });

  it.each(["+45292", "45,292", "4.5e4", "45292.", ".5", "", "0x10", "45292 "])("rejects %j", (text) => {
    expect(s1900.parse(text)).toBeUndefined();
  });

  it("mixes with strftime patterns in a list", () => {
    const p = parserFor({ type: "date", format: ["%Y-%m-%d", "serial-1900"] });
    expect(p.parse("2024-01-01")).toEqual(p.parse("45292"));
    expect(p.expected).toBe("a date as %Y-%m-%d or serial-1900");
  });

  it("reads a serial fraction as the time of day in a timestamp column", () => {
    const ts = parserFor({ type: "timestamp", format: "serial-1900" });
    // 0.5 day = 12:00; 0.25 = 06:00 (ECMA-376 Part 4: the fraction is the portion of the day)
    expect(ts.parse("45292.5")).toEqual(timestampValue(Date.UTC(2024, 0, 1, 12), false));
    expect(ts.parse("45292.25")).toEqual(timestampValue(Date.UTC(2024, 0, 1, 6), false));
    expect(ts.parse("45292")).toEqual(timestampValue(Date.UTC(2024, 0, 1), false));
    expect(ts.parse("60.5")).toBeUndefined();
    const ts1904 = parserFor({ type: "timestamp", format: "serial-1904" });
    expect(ts1904.parse("43830.75")).toEqual(timestampValue(Date.UTC(2024, 0, 1, 18), false));
  });
});
