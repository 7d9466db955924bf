import { describe, expect, it } from "vitest";
import { dateValue } from "../../src/values.js";
import { errorsFor, parserFor, utcDays } from "./helpers.js";

const d = (y: number, m: number, day: number) => dateValue(utcDays(y, m, day));

describe("date, default %Y-%m-%d", () => {
  const p = parserFor({ type: "date" });
  it("accepts ISO dates", () => {
    expect(p.parse("2024-03-07")).toEqual(d(2024, 3, 7));
    expect(p.parse("1970-01-01")).toEqual(dateValue(0));
    expect(p.parse("9999-12-31")).toEqual(d(9999, 12, 31));
    expect(p.parse("1899-12-31")).toEqual(d(1899, 12, 31));
  });
  // POSIX strptime: "leading zeros are permitted but not required" for %m and %d
  it("accepts month and day without leading zeros", () => {
    expect(p.parse("2024-3-7")).toEqual(d(2024, 3, 7));
  });
  it.each(["2024-02-30", "2023-02-29", "2024-13-01", "2024-00-10", "2024-04-31", "2024-01-00", "24-01-01", "20240-01-01", "2024/01/01", "2024-01-01T00:00", "2024-001-01", "2024-01-1x", "abc"])(
    "rejects %s",
    (text) => {
      expect(p.parse(text)).toBeUndefined();
    },
  );
  it("names the format", () => {
    expect(p.expected).toBe("a date as %Y-%m-%d");
  });
});

describe("strftime directives", () => {
  it("tries formats in the order listed", () => {
    const us = parserFor({ type: "date", format: ["%m/%d/%Y", "%d/%m/%Y"] });
    expect(us.parse("03/04/2024")).toEqual(d(2024, 3, 4));
    expect(us.parse("25/12/2024")).toEqual(d(2024, 12, 25));
    expect(us.expected).toBe("a date as %m/%d/%Y or %d/%m/%Y");
  });

  // POSIX strptime %y: [69,99] -> 1969-1999, [00,68] -> 2000-2068
  it.each([
    ["01/02/69", d(1969, 1, 2)],
    ["01/02/99", d(1999, 1, 2)],
    ["01/02/00", d(2000, 1, 2)],
    ["01/02/68", d(2068, 1, 2)],
    ["1/2/5", d(2005, 1, 2)],
  ])("two-digit year pivot: %s", (text, value) => {
    expect(parserFor({ type: "date", format: "%m/%d/%y" }).parse(text)).toEqual(value);
  });

  it("%b takes English month names and abbreviations in any case", () => {
    const p = parserFor({ type: "date", format: "%d %b %Y" });
    expect(p.parse("07 Mar 2024")).toEqual(d(2024, 3, 7));
    expect(p.parse("7 MARCH 2024")).toEqual(d(2024, 3, 7));
    expect(p.parse("1 may 2024")).toEqual(d(2024, 5, 1));
    expect(p.parse("30 June 2024")).toEqual(d(2024, 6, 30));
    expect(p.parse("30 Jun 2024")).toEqual(d(2024, 6, 30));
    expect(p.parse("1 Sept 2024")).toBeUndefined();
    expect(p.parse("1 Mär 2024")).toBeUndefined();
    expect(p.parse("1 Ma 2024")).toBeUndefined();
    expect(p.parse("31 Apr 2024")).toBeUndefined();
    expect(parserFor({ type: "date", format: "%b-%d-%Y" }).parse("dec-25-2024")).toEqual(d(2024, 12, 25));
    // POSIX strptime: %B is the same directive as %b
    expect(parserFor({ type: "date", format: "%B %d, %Y" }).parse("September 3, 2024")).toEqual(d(2024, 9, 3));
  });

  it("%e takes a space-padded or unpadded day", () => {
    const p = parserFor({ type: "date", format: "%b %e %Y" });
    expect(p.parse("Mar  7 2024")).toEqual(d(2024, 3, 7));
    expect(p.parse("Mar 7 2024")).toEqual(d(2024, 3, 7));
    expect(p.parse("Mar 17 2024")).toEqual(d(2024, 3, 17));
    expect(p.parse("Mar 07 2024")).toEqual(d(2024, 3, 7));
    expect(p.parse("Mar  17 2024")).toBeUndefined();
  });

  it("%j counts days of the year, 366 only in leap years", () => {
    const p = parserFor({ type: "date", format: "%Y-%j" });
    expect(p.parse("2024-001")).toEqual(d(2024, 1, 1));
    expect(p.parse("2024-60")).toEqual(d(2024, 2, 29));
    expect(p.parse("2023-060")).toEqual(d(2023, 3, 1));
    expect(p.parse("2024-366")).toEqual(d(2024, 12, 31));
    expect(p.parse("2023-366")).toBeUndefined();
    expect(p.parse("2023-000")).toBeUndefined();
    expect(p.parse("2023-1000")).toBeUndefined();
  });

  it("needs full width where number directives touch", () => {
    const p = parserFor({ type: "date", format: "%Y%m%d" });
    expect(p.parse("20240307")).toEqual(d(2024, 3, 7));
    expect(p.parse("2024037")).toBeUndefined();
    expect(p.parse("202437")).toBeUndefined();
    const md = parserFor({ type: "date", format: "%m%d%y" });
    expect(md.parse("111")).toBeUndefined();
    expect(md.parse("011124")).toEqual(d(2024, 1, 11));
  });

  it("matches literal characters and %% exactly", () => {
    const p = parserFor({ type: "date", format: "%d%%%m%%%Y" });
    expect(p.parse("07%03%2024")).toEqual(d(2024, 3, 7));
    expect(p.parse("07%03%2024 ")).toBeUndefined();
    expect(parserFor({ type: "date", format: "Y%Y M%m D%d" }).parse("Y2024 M3 D7")).toEqual(d(2024, 3, 7));
  });
});

describe("date format errors", () => {
  it("points at the bad entry of a list", () => {
    const errors = errorsFor({ type: "date", format: ["%Y-%m-%d", "%Y-%Q-%d"] });
    expect(errors.map((e) => e.path)).toEqual([["format", 1]]);
    // the message lists the supported directives (checked by presence, not wording)
    for (const dir of ["%Y", "%m", "%d", "%y", "%b", "%e", "%j"]) expect(errors[0]?.message).toContain(dir);
  });
  it("points at a single format without an index", () => {
    expect(errorsFor({ type: "date", format: "%Y-%m-%Q" }).map((e) => e.path)).toEqual([["format"]]);
  });
  it.each([
    ["%Y-%m"], // no day
    ["%m-%d"], // no year
    ["%Y-%m-%d %H:%M"], // time directives belong to timestamp columns
    ["%Y-%j-%d"], // %j with a day
    ["%Y-%m-%d-%Y"], // year twice
    ["%y-%m-%d %Y"],
    ["%Y-%m-%d %b"], // month twice
    ["%Y-%m-%"], // lone %
    [""],
    ["email"],
  ])("rejects the pattern %j", (format) => {
    expect(errorsFor({ type: "date", format: ["%Y-%m-%d", format] }).map((e) => e.path)).toEqual([["format", 1]]);
  });
  it("rejects an empty list and non-string entries", () => {
    expect(errorsFor({ type: "date", format: [] }).map((e) => e.path)).toEqual([["format"]]);
    expect(errorsFor({ type: "date", format: ["%Y", 5] as unknown as string[] }).map((e) => e.path)).toEqual([
      ["format", 1],
      ["format", 0],
    ]);
  });
});

describe("a format name that is not a serial system", () => {
  // SPEC §1.1 names two: serial-1900 and serial-1904; the error lists what is allowed.
  it("is refused at its place, naming the allowed forms", () => {
    const errors = errorsFor({ type: "date", format: ["%Y-%m-%d", "serial-2000"] });
    expect(errors.map((e) => e.path)).toEqual([["format", 1]]);
    expect(errors[0]?.message).toMatch(/serial-1900.*serial-1904/);
  });
});
