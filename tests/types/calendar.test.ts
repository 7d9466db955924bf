import { describe, expect, it } from "vitest";
import { civilFromDays, daysFromCivil, daysInMonth, isLeapYear, todayDays } from "../../src/types/calendar.js";
import { dateValue } from "../../src/values.js";
import { parserFor, utcDays } from "./helpers.js";

describe("Gregorian leap-year rule through date parsing", () => {
  const parse = parserFor({ type: "date" }).parse;
  // Source: the Gregorian calendar as ISO 8601 adopts it — divisible by 4, except centuries unless divisible by 400.
  it.each([
    [2000, true],
    [1900, false],
    [2024, true],
    [2100, false],
    [2023, false],
    [1600, true],
  ])("Feb 29 of %i exists: %s", (year, leap) => {
    const v = parse(`${year}-02-29`);
    if (leap) expect(v).toEqual(dateValue(utcDays(year, 2, 29)));
    else expect(v).toBeUndefined();
    expect(isLeapYear(year)).toBe(leap);
    expect(daysInMonth(year, 2)).toBe(leap ? 29 : 28);
  });
});

describe("day numbers against Date.UTC", () => {
  // Reference: JavaScript's Date.UTC (ECMA-262 MakeDay, proleptic Gregorian) as an independent computation.
  it("daysFromCivil and civilFromDays agree with Date.UTC on every day from 1600 to 2400", () => {
    const start = Date.UTC(1600, 0, 1) / 86_400_000;
    const end = Date.UTC(2400, 11, 31) / 86_400_000;
    let checked = 0;
    for (let days = start; days <= end; days++) {
      const d = new Date(days * 86_400_000);
      const y = d.getUTCFullYear();
      const m = d.getUTCMonth() + 1;
      const day = d.getUTCDate();
      if (daysFromCivil(y, m, day) !== days) throw new Error(`daysFromCivil ${y}-${m}-${day}`);
      const c = civilFromDays(days);
      if (c.year !== y || c.month !== m || c.day !== day) throw new Error(`civilFromDays ${days}`);
      checked++;
    }
    expect(checked).toBe(end - start + 1);
  });

  it("parses every 97th day from 1800 to 2200 to the Date.UTC day number", () => {
    const parse = parserFor({ type: "date", format: ["%Y-%m-%d", "%d.%m.%Y"] }).parse;
    for (let days = utcDays(1800, 1, 1); days < utcDays(2200, 1, 1); days += 97) {
      const iso = new Date(days * 86_400_000).toISOString().slice(0, 10);
      expect(parse(iso)).toEqual(dateValue(days));
      const [y, m, d] = iso.split("-");
      expect(parse(`${d}.${m}.${y}`)).toEqual(dateValue(days));
    }
  });
});

describe("todayDays", () => {
  it("counts whole UTC days since 1970-01-01 from an injected clock", () => {
    expect(todayDays(new Date("2024-01-01T23:59:59.999Z"))).toBe(utcDays(2024, 1, 1));
    expect(todayDays(new Date("1970-01-01T00:00:00Z"))).toBe(0);
    expect(todayDays(new Date("1969-12-31T12:00:00Z"))).toBe(-1);
    expect(todayDays()).toBe(Math.floor(Date.now() / 86_400_000));
  });
});
