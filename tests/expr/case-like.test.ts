import { describe, expect, test } from "vitest";
import { compiled, envOf, value } from "./env.js";

describe("CASE", () => {
  const env = envOf({ qty: "integer", tier: "text" });
  test("searched CASE takes the first true branch; a NULL condition goes on to the next", () => {
    const e = compiled("CASE WHEN qty > 100 THEN 'bulk' WHEN qty > 10 THEN 'case' WHEN qty IS NULL THEN 'none' ELSE 'unit' END = tier", env);
    expect(e.evaluate([500, "bulk"])).toBe(true);
    expect(e.evaluate([50, "case"])).toBe(true);
    expect(e.evaluate([5, "unit"])).toBe(true);
    expect(e.evaluate([5, "case"])).toBe(false);
    // qty NULL: `qty > 100` and `qty > 10` are unknown, so CASE reaches `qty IS NULL`.
    expect(e.evaluate([null, "none"])).toBe(true);
  });
  test("without ELSE and no true branch, CASE is NULL", () => {
    const e = compiled("(CASE WHEN qty > 100 THEN 1 END) IS NULL", env);
    expect(e.evaluate([5, null])).toBe(true);
    expect(e.evaluate([500, null])).toBe(false);
  });
  test("simple CASE compares with =; a NULL subject matches no WHEN", () => {
    const e = compiled("CASE tier WHEN 'bulk' THEN qty >= 100 WHEN 'unit' THEN qty < 100 ELSE FALSE END", env);
    expect(e.evaluate([150, "bulk"])).toBe(true);
    expect(e.evaluate([15, "bulk"])).toBe(false);
    expect(e.evaluate([15, "unit"])).toBe(true);
    expect(e.evaluate([15, null])).toBe(false);
    expect(value("CASE NULL WHEN NULL THEN 1 ELSE 2 END = 2")).toBe(true);
  });
  test("branches are evaluated lazily: a later division by zero is not reached", () => {
    expect(value("CASE WHEN TRUE THEN 1 ELSE 1 / 0 END = 1")).toBe(true);
  });
});

describe("LIKE (ISO/IEC 9075 <like predicate>: % any run, _ one character, case-sensitive)", () => {
  const env = envOf({ s: "text" });
  const like = (s: string | null, pattern: string): unknown => compiled(`s LIKE '${pattern.replaceAll("'", "''")}'`, env).evaluate([s]);
  test.each([
    ["INV-0000123", "INV-%", true],
    ["inv-0000123", "INV-%", false],
    ["INV-0000123", "%123", true],
    ["INV-0000123", "%000%", true],
    ["INV-0000123", "INV-_______", true],
    ["INV-0000123", "INV-______", false],
    ["abc", "abc", true],
    ["abc", "ab", false],
    ["abc", "a%c", true],
    ["ac", "a%c", true],
    ["abcbc", "a%bc", true],
    ["abcbd", "a%bc", false],
    ["", "%", true],
    ["", "_", false],
    ["x", "%%%", true],
    ["mississippi", "%iss%ppi", true],
    ["mississippi", "m%s_s%i", true],
    ["mississippi", "m%s_z%i", false],
    ["O'Brien Outfitters", "O'%", true],
    ["tent 🏕 kit", "tent _ kit", true], // one character, though two UTF-16 units
    ["🏕", "__", false],
  ])("%s LIKE %s = %s", (s, p, expected) => {
    expect(like(s, p)).toBe(expected);
  });
  test("NULL operand or pattern is unknown; NOT LIKE negates", () => {
    expect(like(null, "%")).toBe(null);
    expect(compiled("s LIKE NULL", env).evaluate(["a"])).toBe(null);
    expect(compiled("s NOT LIKE 'a%'", env).evaluate(["abc"])).toBe(false);
    expect(compiled("s NOT LIKE 'a%'", env).evaluate(["bcd"])).toBe(true);
    expect(compiled("s NOT LIKE 'a%'", env).evaluate([null])).toBe(null);
  });
  test("ESCAPE makes % and _ literal", () => {
    const e = compiled("s LIKE '%!%' ESCAPE '!'", env);
    expect(e.evaluate(["15%"])).toBe(true);
    expect(e.evaluate(["15"])).toBe(false);
    const u = compiled("s LIKE 'a!_b' ESCAPE '!'", env);
    expect(u.evaluate(["a_b"])).toBe(true);
    expect(u.evaluate(["axb"])).toBe(false);
    expect(compiled("s LIKE 'a!!b' ESCAPE '!'", env).evaluate(["a!b"])).toBe(true);
  });
  test("a pattern from the row is matched too", () => {
    const e = compiled("s LIKE t || '%'", envOf({ s: "text", t: "text" }));
    expect(e.evaluate(["INV-1", "INV"])).toBe(true);
    expect(e.evaluate(["CRN-1", "INV"])).toBe(false);
    expect(e.evaluate(["CRN-1", null])).toBe(null);
  });
  test("many % against a long text finishes (no exponential backtracking)", () => {
    expect(like("a".repeat(20_000), "%a%a%a%a%a%a%a%b")).toBe(false);
  });
});
