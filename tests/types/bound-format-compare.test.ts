import { describe, expect, it } from "vitest";
import { compareValues, formatValue, parseBound } from "../../src/types/index.js";
import { dateValue, timestampValue, timeValue, type Value } from "../../src/values.js";
import { parserFor, utcDays } from "./helpers.js";

describe("parseBound", () => {
  it("takes numbers for integer and decimal columns", () => {
    expect(parseBound({ type: "integer" }, 1)).toBe(1);
    expect(parseBound({ type: "decimal" }, 0.6)).toBe(0.6);
    expect(parseBound({ type: "decimal" }, "0.6")).toBeUndefined();
    expect(parseBound({ type: "integer" }, Number.NaN)).toBeUndefined();
  });
  it("takes ISO dates whatever the delivery format", () => {
    const spec = { type: "date", format: "%d/%m/%Y" } as const;
    expect(parseBound(spec, "2024-01-31")).toEqual(dateValue(utcDays(2024, 1, 31)));
    expect(parseBound(spec, "31/01/2024")).toBeUndefined();
    expect(parseBound(spec, "2023-02-29")).toBeUndefined();
    expect(parseBound(spec, "2024-1-31")).toBeUndefined();
    expect(parseBound(spec, 20240131)).toBeUndefined();
  });
  it("takes RFC 3339 timestamps or a bare date for timestamp columns", () => {
    expect(parseBound({ type: "timestamp" }, "2024-01-01T00:00:00Z")).toEqual(timestampValue(Date.UTC(2024, 0, 1), true));
    // A bare date is that day's midnight UTC (README), so it is a zoned instant and reads back with Z.
    expect(parseBound({ type: "timestamp" }, "2024-01-01")).toEqual(timestampValue(Date.UTC(2024, 0, 1), true));
    expect(parseBound({ type: "timestamp" }, "yesterday")).toBeUndefined();
  });
  it("takes hh:mm[:ss] for time columns", () => {
    expect(parseBound({ type: "time" }, "08:30")).toEqual(timeValue(8 * 3600 + 30 * 60));
    expect(parseBound({ type: "time" }, "17:00:30")).toEqual(timeValue(17 * 3600 + 30));
    expect(parseBound({ type: "time" }, "25:00")).toBeUndefined();
  });
  it("has no bounds for text and boolean", () => {
    expect(parseBound({ type: "text" }, "a")).toBeUndefined();
    expect(parseBound({ type: "boolean" }, 1)).toBeUndefined();
  });
});

describe("formatValue", () => {
  it.each<[Value, string]>([
    [null, ""],
    ["abc", "abc"],
    [0.1, "0.1"],
    [0.30000000000000004, "0.30000000000000004"],
    [-0, "0"],
    [1234567, "1234567"],
    [true, "true"],
    [false, "false"],
    [dateValue(0), "1970-01-01"],
    [dateValue(utcDays(2024, 2, 29)), "2024-02-29"],
    [dateValue(utcDays(1900, 1, 1)), "1900-01-01"],
    [dateValue(utcDays(9999, 12, 31) + 1), "+010000-01-01"],
    [timeValue(0), "00:00:00"],
    [timeValue(86_399), "23:59:59"],
    [timestampValue(Date.UTC(1985, 3, 12, 23, 20, 50, 520), true), "1985-04-12T23:20:50.520Z"],
    [timestampValue(Date.UTC(2024, 0, 1, 10), false), "2024-01-01T10:00:00"],
    [timestampValue(Date.UTC(1969, 11, 31, 23, 59, 59), true), "1969-12-31T23:59:59Z"],
  ])("renders %j as %s", (value, text) => {
    expect(formatValue(value)).toBe(text);
  });

  // Reference: Date.prototype.toISOString (ECMA-262) for the zoned form, over a range of instants.
  it("matches toISOString for zoned timestamps", () => {
    for (let ms = Date.UTC(1901, 0, 1); ms < Date.UTC(2099, 0, 1); ms += 987_654_321_123) {
      const iso = new Date(ms).toISOString();
      expect(formatValue(timestampValue(ms, true))).toBe(iso.endsWith(".000Z") ? iso.replace(".000Z", "Z") : iso);
    }
  });

  it("round-trips what the parsers read", () => {
    const ts = parserFor({ type: "timestamp" });
    for (const text of ["2024-03-07T09:05:30Z", "2024-03-07T09:05:30.250Z", "2024-03-07T09:05:30"]) expect(formatValue(ts.parse(text) ?? null)).toBe(text);
    const dec = parserFor({ type: "decimal" });
    for (const text of ["0.1", "12.5", "-3.75", "1234567.891"]) expect(formatValue(dec.parse(text) ?? null)).toBe(text);
  });
});

describe("compareValues", () => {
  it.each<[Value, Value, number]>([
    [1, 2, -1],
    [2.5, 2.5, 0],
    [-1, -2, 1],
    ["a", "b", -1],
    ["B", "a", -1], // code-unit order: upper case sorts first
    ["é", "z", 1],
    [false, true, -1],
    [true, true, 0],
    [dateValue(10), dateValue(9), 1],
    [timestampValue(5, true), timestampValue(5, false), 0],
    [timestampValue(4, false), timestampValue(5, true), -1],
    [timeValue(60), timeValue(3600), -1],
  ])("compare(%j, %j) has sign %i", (a, b, s) => {
    expect(Math.sign(compareValues(a, b))).toBe(s);
    expect(Math.sign(compareValues(b, a))).toBe(-s || 0);
  });

  it("orders parsed timestamps across offsets by instant", () => {
    const p = parserFor({ type: "timestamp" });
    const a = p.parse("1996-12-19T16:39:57-08:00") ?? null;
    const b = p.parse("1996-12-20T00:39:58Z") ?? null;
    expect(compareValues(a, b)).toBeLessThan(0);
  });
});
