/** Text shapes: the patterns a draft proposes must match every value they came from, and say something. */
import { describe, expect, it } from "vitest";
import { compileSafeRegex } from "../../src/safe-regex.js";
import { createShapeTracker } from "../../src/infer/shape.js";

function shapeOf(values: readonly string[], constants = true): string | undefined {
  const t = createShapeTracker();
  for (const v of values) t.add(v);
  return t.pattern(constants);
}

describe("shape patterns", () => {
  it.each([
    [["AB-12", "ABC-3"], "^[A-Z]{2,3}-[0-9]{1,2}$"],
    [["D-1042", "D-2051"], "^D-[0-9]{4}$"],
    [["v1.2.0", "v10.0.3"], "^[a-z0-9]{2,3}\\.[0-9]\\.[0-9]$"],
    [["(555) 0101", "(555) 0199"], "^\\(555\\) [0-9]{4}$"],
    [["a1b2", "zz9"], "^[a-z0-9]{3,4}$"],
    [["12345", "67890"], "^[0-9]{5}$"],
  ])("%j -> %s, which the safe-regex compiler accepts and every value matches", (values, expected) => {
    const source = shapeOf(values);
    expect(source).toBe(expected);
    const re = compileSafeRegex(source as string);
    expect(re).toBeInstanceOf(RegExp);
    for (const v of values) expect((re as RegExp).test(v), v).toBe(true);
  });

  it.each([
    ["different separators", ["AB-12", "AB/12"]],
    ["a different number of parts", ["AB-12", "AB-12-3"]],
    ["letters outside ASCII", ["Zürich-1", "Bern-2"]],
    ["a quote", ['5"-1', '6"-2']],
    ["a lone run of letters", ["Tent", "Stove"]],
    ["letters apart, no digits, no fixed word", ["left gate", "rang twice"]],
  ])("none for %s", (_why, values) => {
    expect(shapeOf(values)).toBeUndefined();
  });

  it("without constants, fixed words become classes (sensitive columns)", () => {
    expect(shapeOf(["INV-2611402", "INV-2611417"], false)).toBe("^[A-Z]{3}-[0-9]{7}$");
  });
});
