/**
 * `min_length` / `max_length` (SPEC §1.1) count Unicode code points of the trimmed text, so a letter
 * outside the Basic Multilingual Plane (an emoji) counts once although JavaScript stores it as two units.
 */
import { describe, expect, it } from "vitest";
import type { ColumnSpec } from "../../src/contract/types.js";
import { passes } from "./helpers.js";

const text: ColumnSpec = { type: "text" };

describe("min_length and max_length", () => {
  it("are inclusive", () => {
    const spec: ColumnSpec = { ...text, min_length: 3, max_length: 5 };
    expect(["ab", "abc", "abcde", "abcdef"].map((t) => [passes("min_length", spec, t), passes("max_length", spec, t)])).toEqual([
      [false, true],
      [true, true],
      [true, true],
      [true, false],
    ]);
  });

  it("an emoji counts once", () => {
    const three = "\u{1F3D5}\u{1F3D5}\u{1F3D5}"; // three camping emoji, six UTF-16 units
    expect(three.length).toBe(6);
    expect(passes("max_length", { ...text, max_length: 3 }, three)).toBe(true);
    expect(passes("min_length", { ...text, min_length: 3 }, three)).toBe(true);
    expect(passes("min_length", { ...text, min_length: 4 }, three)).toBe(false);
    expect(passes("max_length", { ...text, max_length: 2 }, three)).toBe(false);
    expect(passes("max_length", { ...text, max_length: 5 }, `${three}ab`)).toBe(true);
  });

  it("a precomposed accented letter counts once; a combining mark is a code point of its own", () => {
    expect(passes("max_length", { ...text, max_length: 4 }, "Zoë!")).toBe(true);
    expect(passes("max_length", { ...text, max_length: 4 }, "Zoe\u0308!")).toBe(false);
  });

  it("agrees with ECMAScript's string iterator, which yields code points (ECMA-262 String.prototype[@@iterator])", () => {
    const samples = ["", "a", "tent", "\u{1F3D5}", "a\u{1F3D5}b", "東京都", "e\u0301", "\u{1F469}\u200D\u{1F4BB}", "𝔸𝔹ℂ", "trail\u{10FFFF}"];
    for (const s of samples) {
      const n = [...s].length;
      expect([s, passes("max_length", { ...text, max_length: n }, s)]).toEqual([s, true]);
      if (n > 0) expect([s, passes("max_length", { ...text, max_length: n - 1 }, s)]).toEqual([s, false]);
      expect([s, passes("min_length", { ...text, min_length: n }, s)]).toEqual([s, true]);
      expect([s, passes("min_length", { ...text, min_length: n + 1 }, s)]).toEqual([s, false]);
    }
  });
});
