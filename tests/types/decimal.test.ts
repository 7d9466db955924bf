import { describe, expect, it } from "vitest";
import { decimalScale } from "../../src/types/index.js";
import { errorsFor, parserFor } from "./helpers.js";

describe("decimal", () => {
  const plain = parserFor({ type: "decimal" });
  it.each([
    ["12.50", 12.5],
    ["-3.25", -3.25],
    ["+0.1", 0.1],
    ["42", 42],
    [".5", 0.5], // SQL <exact numeric literal> allows ".5" and "5." (ISO/IEC 9075)
    ["5.", 5],
    ["-.25", -0.25],
    ["0.1", 0.1],
    ["0.30000000000000004", 0.30000000000000004],
    ["-0.0", 0],
  ])("accepts %s", (text, value) => {
    expect(plain.parse(text)).toBe(value);
  });
  it.each(["1e5", "1.5E-3", "NaN", "Infinity", "-Infinity", ".", "-.", "1.2.3", "1,5", "15%", "$5", "5 ", "(5)", "0x1A", "1_000"])("rejects %s", (text) => {
    expect(plain.parse(text)).toBeUndefined();
  });

  it("rejects a number too large for a double", () => {
    expect(plain.parse("9".repeat(400))).toBeUndefined();
  });

  describe("comma as decimal mark", () => {
    const eu = parserFor({ type: "decimal", decimal_mark: ",", thousands: "." });
    it.each([
      ["1.234,50", 1234.5],
      ["1234,5", 1234.5],
      ["0,07", 0.07],
      ["-1.000.000", -1000000],
    ])("accepts %s", (text, value) => {
      expect(eu.parse(text)).toBe(value);
    });
    it.each(["1,234.50", "1.23,4", "1.2345,6", "1,2,3"])("rejects %s", (text) => {
      expect(eu.parse(text)).toBeUndefined();
    });
    it("describes the marks", () => {
      expect(eu.expected).toContain('","');
      expect(eu.expected).toContain('"."');
    });
  });

  describe("percent", () => {
    const pct = parserFor({ type: "decimal", percent: true });
    it.each([
      ["15%", 0.15],
      ["12.5%", 0.125],
      ["0.15", 0.15],
      ["100%", 1],
      ["-2%", -0.02],
      ["7 %", 0.07],
      ["0.07%", 0.0007],
    ])("reads %s as %d", (text, value) => {
      // same double as writing the fraction directly: no float noise from dividing by 100
      expect(pct.parse(text)).toBe(value);
    });
    it.each(["%", "15%%", "15 % ", "%15", "15  %"])("rejects %s", (text) => {
      expect(pct.parse(text)).toBeUndefined();
    });
    it("combines with a comma mark", () => {
      expect(parserFor({ type: "decimal", percent: true, decimal_mark: "," }).parse("12,5 %")).toBe(0.125);
    });
  });

  it("rejects conflicting marks at compile time", () => {
    expect(errorsFor({ type: "decimal", thousands: "." })[0]?.path).toEqual(["thousands"]);
    expect(errorsFor({ type: "decimal", decimal_mark: ",", thousands: "," })[0]?.path).toEqual(["thousands"]);
    expect(errorsFor({ type: "decimal", decimal_mark: ";" })[0]?.path).toEqual(["decimal_mark"]);
  });

  it.each([
    ["12.50", {}, 2],
    ["12", {}, 0],
    ["5.", {}, 0],
    [".125", {}, 3],
    ["1,234.5", { thousands: "," }, 1],
    ["1.234,567", { decimal_mark: ",", thousands: "." }, 3],
    ["1.234", { decimal_mark: ",", thousands: "." }, 0],
    ["12.5%", { percent: true }, 1],
  ])("decimalScale(%s) counts the digits as written", (text, options, scale) => {
    expect(decimalScale(text, { type: "decimal", ...options })).toBe(scale);
  });
});
