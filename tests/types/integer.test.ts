import { describe, expect, it } from "vitest";
import { errorsFor, parserFor } from "./helpers.js";

describe("integer", () => {
  const plain = parserFor({ type: "integer" });
  it.each([
    ["0", 0],
    ["42", 42],
    ["-17", -17],
    ["+5", 5], // SQL numeric literals allow a leading + (ISO/IEC 9075 <signed numeric literal>)
    ["007", 7],
    ["-0", 0],
    ["9007199254740991", Number.MAX_SAFE_INTEGER],
    ["-9007199254740991", -Number.MAX_SAFE_INTEGER],
  ])("accepts %s", (text, value) => {
    expect(plain.parse(text)).toBe(value);
  });

  it("reads -0 as 0, not negative zero", () => {
    expect(Object.is(plain.parse("-0"), 0)).toBe(true);
  });

  it.each(["1.5", "1.", ".5", "1e3", "1E3", "0x10", "NaN", "Infinity", "-", "+", "--1", "1-", "1,234", "1 234", "12a"])(
    "rejects %s",
    (text) => {
      expect(plain.parse(text)).toBeUndefined();
    },
  );

  it("accepts integers of any length, held as the nearest double (bounds settle ties on the digits)", () => {
    expect(plain.parse("9007199254740993")).toBe(9007199254740992);
    expect(plain.parse("99999999999999999999")).toBe(1e20);
  });

  it("names the expected form", () => {
    expect(plain.expected).toBe("an integer");
  });

  describe("with thousands", () => {
    const comma = parserFor({ type: "integer", thousands: "," });
    it.each([
      ["1,234,567", 1234567],
      ["1234567", 1234567],
      ["-12,345", -12345],
      ["999", 999],
      ["1,000", 1000],
    ])("accepts %s", (text, value) => {
      expect(comma.parse(text)).toBe(value);
    });
    it.each(["12,34", "1,2345", ",123", "123,", "1,,234", "1234,567", "1.234"])("rejects %s", (text) => {
      expect(comma.parse(text)).toBeUndefined();
    });
    it("accepts the other declared separators", () => {
      expect(parserFor({ type: "integer", thousands: "." }).parse("1.234.567")).toBe(1234567);
      expect(parserFor({ type: "integer", thousands: "'" }).parse("1'234")).toBe(1234);
      const space = parserFor({ type: "integer", thousands: " " });
      expect(space.parse("1 234 567")).toBe(1234567);
      expect(space.parse("1\u00a0234")).toBe(1234);
      expect(space.parse("1\u202f234")).toBe(1234);
      expect(space.parse("1,234")).toBeUndefined();
    });
    it("rejects a separator that could be part of a number", () => {
      for (const thousands of ["1", "-", "ab", ""]) expect(errorsFor({ type: "integer", thousands })[0]?.path).toEqual(["thousands"]);
    });
  });
});
