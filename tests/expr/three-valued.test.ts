// SQL three-valued logic as specified by ISO/IEC 9075-2 (<boolean value expression>: the truth tables
// for AND, OR and IS; <comparison predicate>, <in predicate>, <between predicate>, <null predicate>).
// The tables below are the standard's, written out by hand (subclause numbers from memory, so not cited).
import { describe, expect, test } from "vitest";
import { isFalse, isTrue } from "../../src/expr/index.js";
import type { Value } from "../../src/values.js";
import { compiled, envOf, value } from "./env.js";

const env = envOf({ p: "boolean", q: "boolean", x: "integer", y: "integer" });
const T = true;
const F = false;
const U = null;
const row = (p: Value, q: Value, x: Value = null, y: Value = null): Value[] => [p, q, x, y];
const run = (source: string, r: readonly Value[]): Value => compiled(source, env).evaluate(r);

describe("ISO/IEC 9075 truth tables", () => {
  // [p, q, p AND q, p OR q]
  const table: readonly [Value, Value, Value, Value][] = [
    [T, T, T, T],
    [T, F, F, T],
    [T, U, U, T],
    [F, T, F, T],
    [F, F, F, F],
    [F, U, F, U],
    [U, T, U, T],
    [U, F, F, U],
    [U, U, U, U],
  ];
  test.each(table)("p=%s q=%s: AND %s, OR %s", (p, q, and, or) => {
    expect(run("p AND q", row(p, q))).toBe(and);
    expect(run("p OR q", row(p, q))).toBe(or);
  });
  test.each([
    [T, F],
    [F, T],
    [U, U],
  ])("NOT %s is %s", (p, not) => {
    expect(run("NOT p", row(p, null))).toBe(not);
  });
  // [p, IS TRUE, IS FALSE, IS UNKNOWN]: IS never yields unknown.
  test.each([
    [T, T, F, F],
    [F, F, T, F],
    [U, F, F, T],
  ])("p=%s: IS TRUE %s, IS FALSE %s, IS UNKNOWN %s", (p, isT, isF, isU) => {
    expect(run("p IS TRUE", row(p, null))).toBe(isT);
    expect(run("p IS FALSE", row(p, null))).toBe(isF);
    expect(run("p IS UNKNOWN", row(p, null))).toBe(isU);
    expect(run("p IS NOT TRUE", row(p, null))).toBe(!isT);
    expect(run("p IS NOT FALSE", row(p, null))).toBe(!isF);
    expect(run("p IS NOT UNKNOWN", row(p, null))).toBe(!isU);
  });
});

describe("comparisons with NULL are unknown", () => {
  test.each(["=", "<>", "!=", "<", "<=", ">", ">="])("x %s y", (op) => {
    expect(run(`x ${op} y`, row(null, null, 1, null))).toBe(null);
    expect(run(`x ${op} y`, row(null, null, null, 1))).toBe(null);
    expect(run(`x ${op} y`, row(null, null, null, null))).toBe(null);
  });
  test.each(["=", "<>", "<", ">="])("x %s NULL and NULL %s x are unknown whatever x holds (a NULL literal is NULL)", (op) => {
    for (const x of [1, null]) {
      expect(run(`x ${op} NULL`, row(null, null, x))).toBe(null);
      expect(run(`NULL ${op} x`, row(null, null, x))).toBe(null);
    }
  });
  test("comparisons of values", () => {
    const r = row(null, null, 2, 3);
    expect([run("x = y", r), run("x <> y", r), run("x != y", r), run("x < y", r), run("x <= y", r), run("x > y", r), run("x >= y", r)]).toEqual([F, T, T, T, T, F, F]);
  });
  test("IS NULL and IS NOT NULL are never unknown", () => {
    expect(run("x IS NULL", row(null, null, null))).toBe(true);
    expect(run("x IS NULL", row(null, null, 0))).toBe(false);
    expect(run("x IS NOT NULL", row(null, null, null))).toBe(false);
    expect(run("x IS NOT NULL", row(null, null, 0))).toBe(true);
    expect(run("(x > 1) IS NULL", row(null, null, null))).toBe(true);
  });
  test("arithmetic with NULL is NULL", () => {
    for (const op of ["+", "-", "*", "/", "%", "||"]) expect(run(`(x ${op} y) IS NULL`, row(null, null, 4, null))).toBe(true);
  });
  test("IS DISTINCT FROM treats NULLs as equal to each other", () => {
    expect(run("x IS DISTINCT FROM y", row(null, null, null, null))).toBe(false);
    expect(run("x IS DISTINCT FROM y", row(null, null, 1, null))).toBe(true);
    expect(run("x IS DISTINCT FROM y", row(null, null, null, 1))).toBe(true);
    expect(run("x IS DISTINCT FROM y", row(null, null, 1, 1))).toBe(false);
    expect(run("x IS NOT DISTINCT FROM y", row(null, null, 1, 2))).toBe(false);
    expect(run("x IS NOT DISTINCT FROM y", row(null, null, null, null))).toBe(true);
  });
});

describe("IN and NOT IN", () => {
  test("a match is true even when the list holds NULL", () => {
    expect(run("x IN (1, NULL)", row(null, null, 1))).toBe(true);
    expect(run("x NOT IN (1, NULL)", row(null, null, 1))).toBe(false);
  });
  test("no match with a NULL in the list is unknown", () => {
    expect(run("x IN (1, NULL)", row(null, null, 2))).toBe(null);
    expect(run("x NOT IN (1, NULL)", row(null, null, 2))).toBe(null);
  });
  test("no match without NULL is false", () => {
    expect(run("x IN (1, 3, 5, 7)", row(null, null, 2))).toBe(false);
    expect(run("x NOT IN (1, 3, 5, 7)", row(null, null, 2))).toBe(true);
    expect(run("x IN (1, 3, 5, 7)", row(null, null, 5))).toBe(true);
  });
  test("NULL operand is unknown", () => {
    expect(run("x IN (1, 2)", row(null, null, null))).toBe(null);
    expect(run("x NOT IN (1, 2)", row(null, null, null))).toBe(null);
  });
  test("items may be expressions over the row", () => {
    expect(run("x IN (y - 1, y + 1)", row(null, null, 4, 3))).toBe(true);
    expect(run("x IN (y - 1, y + 1)", row(null, null, 4, null))).toBe(null);
  });
  test("text items and a set of literals", () => {
    const e = compiled("c IN ('N', 'S', 'E')", envOf({ c: "text" }));
    expect(e.evaluate(["S"])).toBe(true);
    expect(e.evaluate(["s"])).toBe(false);
    expect(e.evaluate([null])).toBe(null);
  });
});

describe("BETWEEN is x >= a AND x <= b", () => {
  test.each([
    [5, 1, 9, T],
    [1, 1, 9, T],
    [9, 1, 9, T],
    [0, 1, 9, F],
    [10, 1, 9, F],
    [5, 9, 1, F], // not symmetric
    [null, 1, 9, U],
    [5, null, 9, U],
    [0, null, 9, U],
    [10, null, 9, F],
    [0, 1, null, F],
    [5, 1, null, U],
  ])("%s BETWEEN %s AND %s", (x, a, b, expected) => {
    const e = envOf({ x: "integer", a: "integer", b: "integer" });
    expect(compiled("x BETWEEN a AND b", e).evaluate([x, a, b])).toBe(expected);
    expect(compiled("x >= a AND x <= b", e).evaluate([x, a, b])).toBe(expected);
    expect(compiled("x NOT BETWEEN a AND b", e).evaluate([x, a, b])).toBe(expected === null ? null : !expected);
  });
});

describe("assert and when truth", () => {
  test("isTrue only for TRUE, isFalse only for FALSE", () => {
    expect([isTrue(true), isTrue(false), isTrue(null)]).toEqual([true, false, false]);
    expect([isFalse(true), isFalse(false), isFalse(null)]).toEqual([false, true, false]);
  });
  test("a blank cell makes a CHECK-style assert unknown, so it passes", () => {
    const v = run("x > 0", row(null, null, null));
    expect(isFalse(v)).toBe(false);
    expect(isTrue(v)).toBe(false);
  });
  test("precedence: NOT binds looser than comparison, AND tighter than OR", () => {
    expect(value("NOT 1 = 2")).toBe(true);
    expect(value("TRUE OR FALSE AND FALSE")).toBe(true);
    expect(value("(TRUE OR FALSE) AND FALSE")).toBe(false);
    expect(value("NOT TRUE IS NULL")).toBe(true);
    expect(value("1 + 2 * 3 = 7")).toBe(true);
    expect(value("-2 * -3 = 6")).toBe(true);
  });
});
