import { describe, expect, test } from "vitest";
import { compileExpression } from "../../src/expr/index.js";
import { compiled, envOf } from "./env.js";

describe("compiled expression", () => {
  const env = envOf({ a: "integer", b: "integer", c: "text", d: "date" });
  test("keeps its source, lists columns in order of first appearance, has no aggregates in row mode", () => {
    const e = compiled("c = 'x' AND (b > a OR c IS NULL) AND b < 10", env);
    expect(e.source).toBe("c = 'x' AND (b > a OR c IS NULL) AND b < 10");
    expect(e.columns).toEqual([2, 1, 0]);
    expect(e.aggregates).toEqual([]);
  });
  test("evaluates many rows with one compilation", () => {
    const e = compiled("a + b > 10", env);
    let passed = 0;
    for (let i = 0; i < 20; i++) if (e.evaluate([i, i, null, null]) === true) passed++;
    expect(passed).toBe(14); // i = 6..19
  });
  test("a short row reads missing cells as NULL", () => {
    expect(compiled("b IS NULL", env).evaluate([1])).toBe(true);
  });
  test("an unknown column fails at its offset", () => {
    const r = compileExpression("zz > 1", env);
    expect(r.ok).toBe(false);
    expect(r.ok ? -1 : r.offset).toBe(0);
  });
  test("constant sub-expressions are folded but still honour NULL", () => {
    expect(compiled("a > 1 + 1", env).evaluate([3, null, null, null])).toBe(true);
    expect(compiled("a > 1 + NULL", env).evaluate([3, null, null, null])).toBe(null);
  });
});
