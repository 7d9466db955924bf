/** `scale` (SPEC §1.1): at most this many digits after the decimal mark, counted as written. */
import { describe, expect, it } from "vitest";
import type { ColumnSpec } from "../../src/contract/types.js";
import { compiled, judge } from "./helpers.js";

function verdicts(spec: ColumnSpec, texts: readonly string[]): Record<string, boolean> {
  const check = compiled("scale", spec);
  return Object.fromEntries(texts.map((t) => [t, judge(check, spec, t) === undefined]));
}

describe("scale", () => {
  it("counts digits after the point as written, trailing zeros included", () => {
    expect(verdicts({ type: "decimal", scale: 2 }, ["12", "12.5", "12.50", "12.505", "1.500", "-0.01", "-0.001", ".25", "7."])).toEqual({
      "12": true,
      "12.5": true,
      "12.50": true,
      "12.505": false,
      "1.500": false,
      "-0.01": true,
      "-0.001": false,
      ".25": true,
      "7.": true,
    });
  });

  it("scale 0 allows whole numbers only", () => {
    expect(verdicts({ type: "decimal", scale: 0 }, ["5", "5.", "5.0", ".5"])).toEqual({ "5": true, "5.": true, "5.0": false, ".5": false });
  });

  it("honours decimal_mark ',' with '.' grouping thousands", () => {
    const spec: ColumnSpec = { type: "decimal", scale: 2, decimal_mark: ",", thousands: "." };
    expect(verdicts(spec, ["1.234,5", "1.234,56", "1.234,567", "1.234.567", "0,001"])).toEqual({
      "1.234,5": true,
      "1.234,56": true,
      "1.234,567": false,
      "1.234.567": true,
      "0,001": false,
    });
  });

  it("honours ',' thousands with '.' mark", () => {
    expect(verdicts({ type: "decimal", scale: 1, thousands: "," }, ["1,234", "1,234.5", "1,234.56"])).toEqual({ "1,234": true, "1,234.5": true, "1,234.56": false });
  });

  it("a percent cell counts the digits written before %, not those of the fraction", () => {
    const spec: ColumnSpec = { type: "decimal", scale: 1, percent: true };
    // 12.5% is 0.125 (three decimals as a fraction) but one digit as written.
    expect(verdicts(spec, ["12.5%", "12.5 %", "12%", "12.55%", "0.5"])).toEqual({ "12.5%": true, "12.5 %": true, "12%": true, "12.55%": false, "0.5": true });
  });
});
