import { describe, expect, test } from "vitest";
import { daysFromCivil, formatIsoDate, parseIsoDate, parseIsoTimestamp } from "../../src/expr/dates.js";
import { dateValue, timestampValue, timeValue } from "../../src/values.js";
import { compiled, envOf, errorOffset, value } from "./env.js";

describe("calendar", () => {
  // ECMA-376 Part 4 spreadsheet serials: 25569 = 1970-01-01, 45292 = 2024-01-01, 2958465 = 9999-12-31.
  test("day numbers agree with the ECMA-376 serial-date worked examples", () => {
    expect(parseIsoDate("2024-01-01")).toBe(45292 - 25569);
    expect(parseIsoDate("9999-12-31")).toBe(2958465 - 25569);
    expect(parseIsoDate("1900-03-01")).toBe(61 - 25569);
    expect(formatIsoDate(45292 - 25569)).toBe("2024-01-01");
  });
  test("Gregorian leap years (a year divisible by 100 is not, unless by 400)", () => {
    expect(parseIsoDate("2024-02-29")).not.toBe(null);
    expect(parseIsoDate("2000-02-29")).not.toBe(null);
    expect(parseIsoDate("2100-02-29")).toBe(null);
    expect(parseIsoDate("2026-02-30")).toBe(null);
    expect(parseIsoDate("2026-04-31")).toBe(null);
    expect(parseIsoDate("2026-13-01")).toBe(null);
    expect(parseIsoDate("2026-1-01")).toBe(null);
  });
  test("round trip over four centuries", () => {
    for (let d = daysFromCivil(1900, 1, 1); d < daysFromCivil(2300, 1, 1); d += 7) expect(parseIsoDate(formatIsoDate(d))).toBe(d);
  });
  test("timestamps with offsets are instants", () => {
    expect(parseIsoTimestamp("2026-01-31T10:00:00+02:00")?.ms).toBe(parseIsoTimestamp("2026-01-31T08:00:00Z")?.ms);
    expect(parseIsoTimestamp("2026-01-31 08:00")).toEqual({ ms: Date.UTC(2026, 0, 31, 8), zoned: false });
    expect(parseIsoTimestamp("2026-01-31T25:00:00Z")).toBe(null);
  });
});

describe("dates in expressions", () => {
  const env = envOf({ invoice_date: "date", ship_date: "date", at: "timestamp", t: "time" });
  const d = (iso: string) => dateValue(parseIsoDate(iso) as number);
  test("dates compare as dates", () => {
    const e = compiled("ship_date >= invoice_date", env);
    expect(e.evaluate([d("2026-01-31"), d("2026-02-01"), null, null])).toBe(true);
    expect(e.evaluate([d("2026-02-01"), d("2026-01-31"), null, null])).toBe(false);
    expect(e.evaluate([d("2026-02-01"), null, null, null])).toBe(null);
  });
  test("date minus date is a number of days; date plus days is a date", () => {
    expect(compiled("ship_date - invoice_date = 29", env).evaluate([d("2024-02-01"), d("2024-03-01"), null, null])).toBe(true);
    expect(compiled("ship_date <= invoice_date + 30", env).evaluate([d("2026-01-01"), d("2026-01-31"), null, null])).toBe(true);
    expect(compiled("ship_date <= invoice_date + 30", env).evaluate([d("2026-01-01"), d("2026-02-01"), null, null])).toBe(false);
    expect(value("DATE '2026-03-01' - 1 = DATE '2026-02-28'")).toBe(true);
    expect(value("DATE '2024-03-01' - DATE '2024-02-01' = 29")).toBe(true);
    expect(value("30 + DATE '2026-01-01' = DATE '2026-01-31'")).toBe(true);
  });
  test("a text literal compared with a date is read as an ISO date", () => {
    const e = compiled("invoice_date >= '2026-01-01'", env);
    expect(e.evaluate([d("2026-01-01"), null, null, null])).toBe(true);
    expect(e.evaluate([d("2025-12-31"), null, null, null])).toBe(false);
    expect(compiled("'2026-01-01' <= invoice_date", env).evaluate([d("2025-12-31"), null, null, null])).toBe(false);
    expect(compiled("invoice_date IN ('2026-01-01', '2026-01-02')", env).evaluate([d("2026-01-02"), null, null, null])).toBe(true);
    expect(compiled("invoice_date BETWEEN '2026-01-01' AND '2026-01-31'", env).evaluate([d("2026-01-15"), null, null, null])).toBe(true);
  });
  test("a date meets a timestamp at midnight UTC; timestamps subtract to days", () => {
    const at = timestampValue(Date.UTC(2026, 0, 31, 12), true);
    expect(compiled("at > invoice_date", env).evaluate([d("2026-01-31"), null, at, null])).toBe(true);
    expect(compiled("at - invoice_date = 0.5", env).evaluate([d("2026-01-31"), null, at, null])).toBe(true);
    expect(compiled("at >= TIMESTAMP '2026-01-31T13:00:00+01:00'", env).evaluate([null, null, at, null])).toBe(true);
    expect(compiled("at > TIMESTAMP '2026-01-31T13:00:01+01:00'", env).evaluate([null, null, at, null])).toBe(false);
  });
  test("times compare as times", () => {
    expect(compiled("t BETWEEN TIME '08:00' AND '17:30'", env).evaluate([null, null, null, timeValue(9 * 3600)])).toBe(true);
    expect(compiled("t < TIME '08:00:00'", env).evaluate([null, null, null, timeValue(9 * 3600)])).toBe(false);
  });
  test("untyped columns still compare by the value's kind", () => {
    const loose = envOf({ a: undefined }, { typed: false });
    expect(compiled("a < '2026-02-01'", loose).evaluate([d("2026-01-31")])).toBe(true);
    expect(compiled("a < '2026-02-01'", loose).evaluate(["2026-03-01"])).toBe(false); // text vs text
    expect(compiled("a < 'not a date'", loose).evaluate([d("2026-01-31")])).toBe(null);
  });
  test("impossible or malformed date literals are compile errors at the literal", () => {
    expect(errorOffset("ship_date > DATE '2026-02-30'", env)).toBe(17);
    expect(errorOffset("ship_date > DATE '2026-2-3'", env)).toBe(17);
    expect(errorOffset("ship_date > '2026-02-30'", env)).toBe(12);
    expect(errorOffset("t > TIME '24:00'", env)).toBe(9);
    expect(errorOffset("at > TIMESTAMP 'yesterday'", env)).toBe(15);
    expect(errorOffset("ship_date > 5", env)).toBe(10);
    expect(errorOffset("ship_date * 2 > 5", env)).toBe(10);
    expect(errorOffset("ship_date + invoice_date > 5", env)).toBe(10);
  });
});
