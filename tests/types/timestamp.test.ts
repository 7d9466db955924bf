import { describe, expect, it } from "vitest";
import { timestampValue } from "../../src/values.js";
import { errorsFor, parserFor } from "./helpers.js";

describe("timestamp, default ISO 8601 / RFC 3339", () => {
  const p = parserFor({ type: "timestamp" });

  // Source: RFC 3339 section 5.8 examples; expected instants computed with Date.UTC.
  it("1985-04-12T23:20:50.52Z", () => {
    expect(p.parse("1985-04-12T23:20:50.52Z")).toEqual(timestampValue(Date.UTC(1985, 3, 12, 23, 20, 50, 520), true));
  });
  it("1996-12-19T16:39:57-08:00 is 1996-12-20T00:39:57Z", () => {
    expect(p.parse("1996-12-19T16:39:57-08:00")).toEqual(p.parse("1996-12-20T00:39:57Z"));
    expect(p.parse("1996-12-19T16:39:57-08:00")).toEqual(timestampValue(Date.UTC(1996, 11, 20, 0, 39, 57), true));
  });
  it("1937-01-01T12:00:27.87+00:20", () => {
    expect(p.parse("1937-01-01T12:00:27.87+00:20")).toEqual(timestampValue(Date.UTC(1937, 0, 1, 11, 40, 27, 870), true));
  });
  // RFC 3339 §5.8 leap-second examples. POSIX "Seconds Since the Epoch" (Base Definitions §4.16) has no
  // leap seconds: its formula puts 23:59:60 on the same count as the next midnight, as Date.UTC does.
  it("1990-12-31T23:59:60Z and 1990-12-31T15:59:60-08:00 are the same leap second", () => {
    const leap = timestampValue(Date.UTC(1990, 11, 31, 23, 59, 60), true);
    expect(p.parse("1990-12-31T23:59:60Z")).toEqual(leap);
    expect(p.parse("1990-12-31T15:59:60-08:00")).toEqual(leap);
  });
  it("rejects a seconds value of 60 anywhere but 23:59 UTC", () => {
    expect(p.parse("1990-12-31T12:00:60Z")).toBeUndefined();
    expect(p.parse("1990-12-31T23:59:60+01:00")).toBeUndefined();
    expect(p.parse("1990-12-31T23:59:61Z")).toBeUndefined();
  });

  it.each([
    ["2024-01-01T10:00:00Z", Date.UTC(2024, 0, 1, 10), true],
    ["2024-01-01t10:00:00z", Date.UTC(2024, 0, 1, 10), true], // RFC 3339 §5.6 NOTE: t and z may be lower case
    ["2024-01-01 10:00:00+02:00", Date.UTC(2024, 0, 1, 8), true], // RFC 3339 §5.6 NOTE: space instead of T
    ["2024-01-01T10:00:00-00:00", Date.UTC(2024, 0, 1, 10), true],
    ["2024-01-01T10:00:00+0530", Date.UTC(2024, 0, 1, 4, 30), true],
    ["2024-01-01T10:00:00+05", Date.UTC(2024, 0, 1, 5), true],
    ["2024-01-01T10:00", Date.UTC(2024, 0, 1, 10), false],
    ["2024-01-01T10:00:00", Date.UTC(2024, 0, 1, 10), false],
    ["2024-01-01T10:00:00.5", Date.UTC(2024, 0, 1, 10, 0, 0, 500), false],
    ["2024-01-01T10:00:00,25Z", Date.UTC(2024, 0, 1, 10, 0, 0, 250), true],
    ["2024-01-01T10:00:00.123999999Z", Date.UTC(2024, 0, 1, 10, 0, 0, 123), true],
    ["2024-12-31T23:59:59.9999Z", Date.UTC(2024, 11, 31, 23, 59, 59, 999), true],
  ])("accepts %s", (text, ms, zoned) => {
    expect(p.parse(text)).toEqual(timestampValue(ms, zoned));
  });

  it.each([
    "2024-01-01",
    "2024-01-01T",
    "2024-01-01T10",
    "2024-01-01T24:00:00Z",
    "2024-01-01T10:60:00Z",
    "2024-02-30T10:00:00Z",
    "2024-01-01T10:00:00.Z",
    "2024-01-01T10:00:00ZZ",
    "2024-01-01T10:00:00+24:00",
    "2024-01-01T10:00:00+01:60",
    "2024-01-01T10:00:00+1",
    "2024-01-01T10:00.5",
    "2024-01-01X10:00:00",
    "2024-01-01  10:00:00",
    "2024-1-01T10:00:00",
  ])("rejects %s", (text) => {
    expect(p.parse(text)).toBeUndefined();
  });
});

describe("timezone policy", () => {
  it("required: a timestamp without offset is a type error", () => {
    const p = parserFor({ type: "timestamp", timezone: "required" });
    expect(p.parse("2024-01-01T10:00:00")).toBeUndefined();
    expect(p.parse("2024-01-01T10:00:00Z")).toEqual(timestampValue(Date.UTC(2024, 0, 1, 10), true));
  });
  it("forbidden: a timestamp with offset is a type error", () => {
    const p = parserFor({ type: "timestamp", timezone: "forbidden" });
    expect(p.parse("2024-01-01T10:00:00Z")).toBeUndefined();
    expect(p.parse("2024-01-01T10:00:00")).toEqual(timestampValue(Date.UTC(2024, 0, 1, 10), false));
  });
  it("optional (default) takes both; unzoned values are read as UTC", () => {
    const p = parserFor({ type: "timestamp" });
    const unzoned = p.parse("2024-01-01T10:00:00");
    const zoned = p.parse("2024-01-01T10:00:00Z");
    expect(unzoned).toEqual(timestampValue(Date.UTC(2024, 0, 1, 10), false));
    expect(zoned).toEqual(timestampValue(Date.UTC(2024, 0, 1, 10), true));
  });
  it("rejects patterns that can never satisfy the policy", () => {
    expect(errorsFor({ type: "timestamp", timezone: "required", format: ["%Y-%m-%d %H:%M%z", "%d.%m.%Y %H:%M"] }).map((e) => e.path)).toEqual([["format", 1]]);
    expect(errorsFor({ type: "timestamp", timezone: "forbidden", format: "%Y-%m-%d %H:%M %z" }).map((e) => e.path)).toEqual([["format"]]);
    expect(errorsFor({ type: "timestamp", timezone: "required", format: ["iso-8601", "serial-1900"] }).map((e) => e.path)).toEqual([["format", 1]]);
  });
});

describe("timestamp strftime patterns", () => {
  it("reads %H %M %S and %z", () => {
    const p = parserFor({ type: "timestamp", format: "%d/%m/%Y %H:%M:%S %z" });
    expect(p.parse("19/12/1996 16:39:57 -0800")).toEqual(timestampValue(Date.UTC(1996, 11, 20, 0, 39, 57), true));
    expect(p.parse("19/12/1996 16:39:57 -08:00")).toEqual(timestampValue(Date.UTC(1996, 11, 20, 0, 39, 57), true));
    expect(p.parse("19/12/1996 16:39:57 Z")).toEqual(timestampValue(Date.UTC(1996, 11, 19, 16, 39, 57), true));
    expect(p.parse("19/12/1996 16:39:57")).toBeUndefined();
    expect(p.parse("19/12/1996 24:00:00 Z")).toBeUndefined();
  });
  it("is unzoned without %z and takes seconds as optional only when the pattern lacks %S", () => {
    const p = parserFor({ type: "timestamp", format: ["%m/%d/%Y %H:%M:%S", "%m/%d/%Y %H:%M"] });
    expect(p.parse("3/7/2024 9:05")).toEqual(timestampValue(Date.UTC(2024, 2, 7, 9, 5), false));
    expect(p.parse("3/7/2024 09:05:30")).toEqual(timestampValue(Date.UTC(2024, 2, 7, 9, 5, 30), false));
    expect(p.parse("3/7/2024")).toBeUndefined();
  });
  it("mixes iso-8601 with patterns", () => {
    const p = parserFor({ type: "timestamp", format: ["iso-8601", "%Y%m%d%H%M%S"] });
    expect(p.parse("20240307090530")).toEqual(p.parse("2024-03-07T09:05:30"));
    expect(p.expected).toBe("a timestamp as ISO 8601 or %Y%m%d%H%M%S");
  });
  it("accepts a leap second at 23:59:60 UTC only", () => {
    const p = parserFor({ type: "timestamp", format: "%Y-%m-%d %H:%M:%S%z" });
    expect(p.parse("1990-12-31 15:59:60-0800")).toEqual(timestampValue(Date.UTC(1990, 11, 31, 23, 59, 60), true));
    expect(p.parse("1990-12-31 15:59:60+0000")).toBeUndefined();
  });
  it.each([["%Y-%m-%d"], ["%Y-%m-%d %H"], ["%Y-%m-%d %H:%S"], ["%Y-%m-%d %H:%M:%f"], ["%Y-%m-%d %I:%M %p"]])("rejects the pattern %j", (format) => {
    expect(errorsFor({ type: "timestamp", format }).map((e) => e.path)).toEqual([["format"]]);
  });
});
