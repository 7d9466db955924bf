import { describe, expect, it } from "vitest";
import { errorsFor, parserFor } from "./helpers.js";

describe("boolean", () => {
  const plain = parserFor({ type: "boolean" });
  it.each(["true", "TRUE", "True", "yes", "YES", "1", "y", "Y"])("%s is true", (text) => {
    expect(plain.parse(text)).toBe(true);
  });
  it.each(["false", "False", "no", "NO", "0", "n", "N"])("%s is false", (text) => {
    expect(plain.parse(text)).toBe(false);
  });
  it.each(["t", "f", "on", "off", "2", "-1", "truth", "yess", "01"])("%s is not a boolean", (text) => {
    expect(plain.parse(text)).toBeUndefined();
  });

  describe("values override", () => {
    const custom = parserFor({ type: "boolean", values: { true: ["J", "ja"], false: ["N", "nein"] } });
    it("accepts only the listed words, ignoring case", () => {
      expect(custom.parse("j")).toBe(true);
      expect(custom.parse("JA")).toBe(true);
      expect(custom.parse("Nein")).toBe(false);
      expect(custom.parse("n")).toBe(false);
      expect(custom.parse("yes")).toBeUndefined();
      expect(custom.parse("true")).toBeUndefined();
      expect(custom.parse("1")).toBeUndefined();
    });
    it("lists the words in the expected text", () => {
      expect(custom.expected).toContain("ja");
      expect(custom.expected).toContain("nein");
    });
    it("takes numbers YAML handed over as their text", () => {
      const numeric = parserFor({ type: "boolean", values: { true: [1] as unknown as string[], false: [0] as unknown as string[] } });
      expect(numeric.parse("1")).toBe(true);
      expect(numeric.parse("0")).toBe(false);
    });
    it("rejects a word listed on both sides, and words that can never match", () => {
      expect(errorsFor({ type: "boolean", values: { true: ["x"], false: ["y", "X"] } }).map((e) => e.path)).toEqual([["values", "false", 1]]);
      expect(errorsFor({ type: "boolean", values: { true: [" x"], false: [""] } }).map((e) => e.path)).toEqual([
        ["values", "true", 0],
        ["values", "false", 0],
      ]);
    });
  });
});
