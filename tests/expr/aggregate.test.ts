// Aggregates follow ISO/IEC 9075 <set function specification>: NULLs are eliminated before SUM, MIN,
// MAX and COUNT(x); COUNT(*) counts rows; SUM, MIN and MAX of no remaining value are NULL.
import { describe, expect, test } from "vitest";
import { compileExpression, createAccumulator, type CompiledExpr } from "../../src/expr/index.js";
import { dateValue } from "../../src/values.js";
import type { Value } from "../../src/values.js";
import { compiled, envOf, errorOffset } from "./env.js";

const env = envOf({ invoice: "text", amount: "decimal", total: "decimal", day: "date" }, { aggregates: true });

function run(expr: CompiledExpr, rows: readonly (readonly Value[])[]): Value {
  const acc = createAccumulator(expr.aggregates);
  for (const r of rows) acc.add(r);
  return expr.evaluate(acc.results());
}

describe("group asserts", () => {
  const lines: Value[][] = [
    ["INV-1", 19.99, 59.97, dateValue(3)],
    ["INV-1", null, null, dateValue(1)],
    ["INV-1", 39.98, null, dateValue(2)],
  ];
  test("sum skips NULL and is exact for decimals", () => {
    expect(run(compiled("sum(amount) = first(total)", env), lines)).toBe(true);
    expect(run(compiled("sum(amount) = 59.97", env), lines)).toBe(true);
    expect(run(compiled("sum(amount) = 59.96", env), lines)).toBe(false);
    const tenths = Array.from({ length: 10 }, () => ["X", 0.1, null, null]);
    expect(run(compiled("sum(amount) = 1", env), tenths)).toBe(true); // 0.9999999999999999 in plain doubles
  });
  test("count() counts rows, count(x) non-NULL values", () => {
    expect(run(compiled("count() = 3", env), lines)).toBe(true);
    expect(run(compiled("count(*) = 3", env), lines)).toBe(true);
    expect(run(compiled("count(amount) = 2", env), lines)).toBe(true);
    expect(run(compiled("count(total) = 1", env), lines)).toBe(true);
  });
  test("min and max skip NULL and order dates as dates", () => {
    expect(run(compiled("min(amount) = 19.99 AND max(amount) = 39.98", env), lines)).toBe(true);
    expect(run(compiled("max(day) - min(day) = 2", env), lines)).toBe(true);
  });
  test("first is the value on the group's first row, NULL included", () => {
    expect(run(compiled("first(total) = 59.97", env), lines)).toBe(true);
    expect(run(compiled("first(amount) IS NULL", env), [lines[1] as Value[], lines[0] as Value[]])).toBe(true);
  });
  test("sum, min and max of only NULLs are NULL, so the assert is unknown; count is 0", () => {
    const blanks: Value[][] = [["INV-2", null, null, null], ["INV-2", null, null, null]];
    expect(run(compiled("sum(amount) = 0", env), blanks)).toBe(null);
    expect(run(compiled("sum(amount) IS NULL AND min(amount) IS NULL AND max(amount) IS NULL", env), blanks)).toBe(true);
    expect(run(compiled("count(amount) = 0", env), blanks)).toBe(true);
  });
  test("aggregate arguments may be row expressions; calls are shared when repeated", () => {
    const e = compiled("sum(amount * 2) = 2 * sum(amount) AND sum(amount)>0", env);
    expect(e.aggregates.map((a) => `${a.fn}:${a.arg?.source ?? ""}`)).toEqual(["sum:amount * 2", "sum:amount"]);
    expect(run(e, lines)).toBe(true);
  });
  test("columns lists the columns read, in order of first appearance", () => {
    const e = compiled("sum(amount) = first(total) AND count(invoice) > 0 AND sum(amount) > 0", env);
    expect(e.columns).toEqual([1, 2, 0]);
    expect(e.aggregates[1]?.arg?.columns).toEqual([2]);
  });
  test("a group assert is a condition like any other: CASE, coalesce, arithmetic", () => {
    expect(run(compiled("abs(coalesce(sum(amount), 0) - coalesce(first(total), 0)) <= 0.01", env), lines)).toBe(true);
  });
});

describe("mode errors", () => {
  test("a bare column in a group assert is an error at the column", () => {
    expect(errorOffset("sum(amount) = total", env)).toBe(14);
  });
  test("an aggregate in a row expression is an error at its name", () => {
    expect(errorOffset("qty > 0 AND sum(qty) > 1", envOf({ qty: "integer" }))).toBe(12);
  });
  test("nested aggregates and wrong arities are errors", () => {
    expect(errorOffset("sum(max(amount)) > 0", env)).toBe(4);
    expect(errorOffset("sum() > 0", env)).toBe(4);
    expect(errorOffset("sum(*) > 0", env)).toBe(4);
    expect(errorOffset("count(amount, total) > 0", env)).toBe(14);
    expect(errorOffset("sum(invoice) > 0", env)).toBe(4);
  });
  test("the compile result names the offset", () => {
    const r = compileExpression("sum(amount) = totl", env);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.offset).toBe(14);
  });
});
