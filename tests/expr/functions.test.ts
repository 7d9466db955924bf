import { describe, expect, test } from "vitest";
import type { Value } from "../../src/values.js";
import { compiled, envOf, errorOffset, value } from "./env.js";

// Top-level expressions are conditions, so scalar results are checked through exact `=` or IS NULL.
describe("numeric functions", () => {
  test.each([
    ["abs(-3.5) = 3.5"],
    ["abs(0) = 0"],
    ["floor(-2.5) = -3"],
    ["ceil(-2.5) = -2"],
    ["floor(2.5) = 2"],
    ["ceil(2.1) = 3"],
    // round: half away from zero (as PostgreSQL's round(numeric); ISO/IEC 9075 leaves ties to the implementation)
    ["round(2.5) = 3"],
    ["round(-2.5) = -3"],
    ["round(0.5) = 1"],
    ["round(1.4999) = 1"],
    ["round(2.675, 2) = 2.68"], // the double nearest 2.675 lies below it; the decimal rounds up
    ["round(1.005, 2) = 1.01"],
    ["round(-1.005, 2) = -1.01"],
    ["round(1234.5678, 1) = 1234.6"],
    ["round(1250, -2) = 1300"],
    ["round(1249, -2) = 1200"],
    ["round(0.125, 2) = 0.13"],
  ])("%s", (e) => {
    expect(value(e)).toBe(true);
  });
  test("NULL in, NULL out", () => {
    for (const f of ["abs(NULL)", "floor(NULL)", "ceil(NULL)", "round(NULL)", "round(1.5, NULL)"]) expect(value(`${f} IS NULL`)).toBe(true);
  });
});

describe("arithmetic", () => {
  test.each([
    ["7 * 19.99 = 139.93"], // 139.92999999999998 in plain doubles
    ["0.1 + 0.2 = 0.3"],
    ["1.15 * 100 = 115"],
    ["0.3 - 0.1 = 0.2"],
    ["0.3 % 0.1 = 0"],
    ["7 % 3 = 1"],
    ["-7 % 3 = -1"], // sign of the dividend, as SQL MOD
    ["7 / 2 = 3.5"], // exact division, not integer division
    ["1 / 3 * 3 = 1"],
    // Exact quotients of decimals, as SQL DECIMAL division gives them; in plain doubles the first is
    // 0.049999999999999996 and the second 0.19999999999999998.
    ["0.15 / 3 = 0.05"],
    ["0.21 / 1.05 = 0.2"],
    ["0.84 / 12 = 0.07"],
    ["100.01 / 5 = 20.002"],
    ["0.6 / 3.0 = 0.2"],
    ["1 / 8 = 0.125"],
    // A quotient that does not end is not cut short to look like a decimal.
    ["1 / 3 <> 0.333333333333333"],
    ["2 + 3 * 4 - 6 / 2 = 11"],
    ["-(2 + 3) = -5"],
  ])("%s", (e) => {
    expect(value(e)).toBe(true);
  });
  test("division and remainder by zero are NULL (SQL raises an error; a data check must not stop)", () => {
    expect(value("(1 / 0) IS NULL")).toBe(true);
    expect(value("(1 % 0) IS NULL")).toBe(true);
    expect(value("1 / 0 = 1")).toBe(null);
  });
  test("decimal sums of cells are exact", () => {
    const e = compiled("qty * unit_price = line_total", envOf({ qty: "integer", unit_price: "decimal", line_total: "decimal" }));
    expect(e.evaluate([7, 19.99, 139.93])).toBe(true);
    expect(e.evaluate([3, 0.1, 0.3])).toBe(true);
    expect(e.evaluate([3, 0.1, 0.31])).toBe(false);
    expect(compiled("a + b + c = 0.6", envOf({ a: "decimal", b: "decimal", c: "decimal" })).evaluate([0.1, 0.2, 0.3])).toBe(true);
  });
  test("|| joins text; NULL in, NULL out", () => {
    expect(value("'INV-' || 12 = 'INV-12'")).toBe(true);
    expect(value("('INV-' || NULL) IS NULL")).toBe(true);
    expect(value("'d' || DATE '2026-01-31' = 'd2026-01-31'")).toBe(true);
  });
});

describe("text functions", () => {
  test.each([
    ["lower('Trail Boot') = 'trail boot'"],
    ["upper('Trail Boot') = 'TRAIL BOOT'"],
    ["trim('  tent  ') = 'tent'"],
    ["length('tent') = 4"],
    ["length('') = 0"],
    ["length('🏕 camp') = 6"], // characters, not UTF-16 units
    ["length('Åsa') = 3"],
    // substr: ISO/IEC 9075 SUBSTRING semantics; examples from the PostgreSQL manual (string functions):
    // substr('alphabet', 3, 2) = 'ph', substring('Thomas' from 2 for 3) = 'hom'
    ["substr('alphabet', 3, 2) = 'ph'"],
    ["substr('Thomas', 2, 3) = 'hom'"],
    ["substr('alphabet', 3) = 'phabet'"],
    ["substr('alphabet', 0, 3) = 'al'"], // start before 1 still counts toward the length
    ["substr('alphabet', -5, 3) = ''"],
    ["substr('alphabet', 20) = ''"],
    ["substr('🏕abc', 2, 2) = 'ab'"],
    ["coalesce(NULL, NULL, 'x') = 'x'"],
    ["coalesce(1, 2) = 1"],
  ])("%s", (e) => {
    expect(value(e)).toBe(true);
  });
  test("NULL in, NULL out", () => {
    for (const f of ["lower(NULL)", "upper(NULL)", "trim(NULL)", "length(NULL)", "substr(NULL, 1)", "substr('a', NULL)", "substr('abc', 1, -1)", "coalesce(NULL, NULL)"]) {
      expect(value(`${f} IS NULL`)).toBe(true);
    }
  });
  test("function names are case-insensitive, column names are not", () => {
    expect(value("LOWER('A') = 'a'")).toBe(true);
    const env = envOf({ Qty: "integer" });
    expect(compiled("Qty > 1", env).evaluate([2])).toBe(true);
    expect(errorOffset("qty > 1", env)).toBe(0);
  });
  test("double-quoted names, with \"\" for a quote", () => {
    const env = envOf({ "Unit Price": "decimal", 'say "hi"': "text", end: "integer" });
    expect(compiled('"Unit Price" > 2 AND "say ""hi""" = \'x\' AND "end" = 1', env).evaluate([3, "x", 1])).toBe(true);
  });
});

describe("matches(text, regex)", () => {
  const env = envOf({ sku: "text", n: "integer" });
  test("ECMAScript regex search, compiled once", () => {
    const e = compiled("matches(sku, '^[A-Z]{3}-\\d{4}$')", env);
    expect(e.evaluate(["TNT-0042", null])).toBe(true);
    expect(e.evaluate(["tnt-0042", null])).toBe(false);
    expect(e.evaluate(["XTNT-0042", null])).toBe(false);
    expect(e.evaluate([null, null])).toBe(null);
    expect(compiled("matches(sku, 'TNT')", env).evaluate(["a TNT b", null])).toBe(true); // unanchored search
    expect(compiled("matches(n, '^4')", env).evaluate([null, 42])).toBe(true);
    expect(compiled("NOT matches(sku, 'it''s')", env).evaluate(["it's", null])).toBe(false);
  });
  test("a catastrophic-backtracking pattern still runs in linear time", () => {
    // On a backtracking engine ^(a+)+$ against 40 a's and a b takes about 2^40 steps.
    const e = compiled("matches(sku, '^(a+)+$')", env);
    expect(e.evaluate(["a".repeat(40) + "b", null])).toBe(false);
    expect(e.evaluate(["a".repeat(40), null])).toBe(true);
  });
  test("the pattern must be a literal; invalid or unbounded patterns are errors at the pattern", () => {
    expect(errorOffset("matches(sku, sku)", env)).toBe(13);
    expect(errorOffset("matches(sku, '(unclosed')", env)).toBe(14);
    expect(errorOffset("matches(sku, '(a)\\1')", env)).toBe(14); // backreference: no linear-time form
    expect(errorOffset("matches(sku, '(?=a)a')", env)).toBe(14); // lookaround
    expect(errorOffset("matches(sku, 'it''s\\p{L}')", env)).toBe(19); // '' counts as one character of the pattern
    expect(errorOffset("matches(sku, 'a', 'i')", env)).toBe(18);
    expect(errorOffset("matches(sku)", env)).toBe(11);
  });
});

describe("lookup(table, key, column)", () => {
  const env = envOf({ region: "text", region_name: "text", n: "integer" });
  test("reads the registry row by key; a missing or NULL key is NULL", () => {
    const e = compiled("region_name = lookup('regions', region, 'name')", env);
    const row = (r: Value, name: Value): Value[] => [r, name, null];
    expect(e.evaluate(row("N", "North"))).toBe(true);
    expect(e.evaluate(row("S", "North"))).toBe(false);
    expect(e.evaluate(row("X", "North"))).toBe(null);
    expect(e.evaluate(row(null, "North"))).toBe(null);
    expect(compiled("lookup('regions', region, 'code') IS NOT NULL", env).evaluate(row("X", null))).toBe(false);
    expect(compiled("lookup('regions', n, 'name') = 'Ten'", env).evaluate([null, null, 10])).toBe(true); // key cast to text
  });
  test("table and column are checked at compile time, at their literal", () => {
    expect(errorOffset("lookup('regionz', region, 'name') = 'x'", env)).toBe(7);
    expect(errorOffset("lookup('regions', region, 'nmae') = 'x'", env)).toBe(26);
    expect(errorOffset("lookup(region, region, 'name') = 'x'", env)).toBe(7);
    expect(errorOffset("lookup('regions', region, name) = 'x'", env)).toBe(26);
    expect(errorOffset("lookup('regions', region) = 'x'", env)).toBe(24);
    expect(errorOffset("lookup('regions', regio, 'name') = 'x'", env)).toBe(18);
  });
});

describe("implicit casts of text (as SQL casts a literal to the other side's type)", () => {
  const loose = envOf({ a: undefined, b: undefined }, { typed: false });
  test.each<[Value, Value, Value]>([
    ["12", 12, true],
    ["12.50", 12.5, true],
    ["0012", 12, true],
    ["abc", 12, null], // text that is no number compares as unknown
    ["true", true, true],
    ["TRUE", true, true],
    ["yes", true, null],
    [false, true, false],
    [12, true, null], // a number and a boolean do not compare
  ])("%s = %s is %s", (a, b, expected) => {
    expect(compiled("a = b", loose).evaluate([a, b])).toBe(expected);
  });
  test("text compares by code unit, case-sensitively", () => {
    expect(compiled("a < b", loose).evaluate(["B", "a"])).toBe(true);
    expect(compiled("a = b", loose).evaluate(["a", "A"])).toBe(false);
  });
  test("FALSE sorts before TRUE", () => {
    expect(value("FALSE < TRUE")).toBe(true);
  });
  test("with declared types, an impossible cast of a literal is a compile error", () => {
    const env = envOf({ qty: "integer", ok: "boolean" });
    expect(errorOffset("qty = 'twelve'", env)).toBe(6);
    expect(errorOffset("qty = '12'", env)).toBe("ok");
    expect(errorOffset("ok = 'maybe'", env)).toBe(5);
    expect(errorOffset("ok = 1", env)).toBe(3);
  });
});

describe("|| past the longest record", () => {
  // README "Choices": text that || would build past MAX_RECORD_SIZE is NULL, so a rule cannot grow
  // one string until the run runs out of memory.
  test("is NULL; shorter text joins as usual", () => {
    const env = envOf({ s: "text" });
    const e = compiled("(s || s || s) IS NULL", env);
    expect(e.evaluate(["ab"])).toBe(false);
    expect(compiled("s || s || s = 'ababab'", env).evaluate(["ab"])).toBe(true);
    const big = "x".repeat(6 * 1024 * 1024);
    expect(e.evaluate([big])).toBe(true);
  });
});
