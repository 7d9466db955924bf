// Every bad expression is refused with the 0-based offset of the offending character; the loader turns
// it into file:line:col inside the YAML string. Offsets are asserted, wording is not.
import { describe, expect, test } from "vitest";
import { compileExpression } from "../../src/expr/index.js";
import { envOf, errorOffset } from "./env.js";

const env = envOf({ qty: "integer", unit_price: "decimal", ship_date: "date", country: "text", "unit-cost": "decimal", ok: "boolean" });

describe("syntax errors", () => {
  test.each<[string, number]>([
    ["qty > 1 AND (unit_price < 3", 27], // unclosed paren: at the end, where ')' was expected
    ["((qty > 1)", 10],
    ["qty > 1)", 7], // a ')' without '('
    ["qty > 1 qty", 8], // trailing junk
    ["qty > 1 2", 8],
    ["qty >", 5],
    ["", 0],
    ["   ", 3],
    ["qty = = 1", 6],
    ["qty == 1", 4],
    ["qty > 1 && ok", 8],
    ["qty > 1; DROP", 7],
    ["qty > 1 #", 8],
    ["country = 'US", 10], // unterminated string: at its opening quote
    ['"unit cost > 1', 0],
    ['"" > 1', 0],
    ["12abc > 1", 2],
    ["1.2.3 > 1", 3],
    ["qty BETWEEN 1 5", 14],
    ["qty IN 1, 2", 7],
    ["qty IN (1, 2", 12],
    ["qty IN (1 2)", 10],
    ["qty IS 1", 7],
    ["qty IS NOT", 10],
    ["ok IS DISTINCT qty", 15],
    ["CASE qty WHEN 1 THEN TRUE", 25],
    ["CASE WHEN qty > 1 TRUE END", 18],
    ["CASE END", 5],
    ["1 < qty < 5", 8], // comparisons do not chain
    ["date > DATE '2026-01-01'", 5], // a keyword as a bare column name
    ["end > 1", 0],
    ["abs(qty", 7],
    ["abs(qty,", 8],
    ['"abs"(qty) > 1', 5],
    ["unit price > 1", 5],
    ["qty > 1 NOT", 8],
  ])("%j fails at %i", (source, offset) => {
    expect(errorOffset(source, env)).toBe(offset);
  });
});

describe("name and type errors", () => {
  test.each<[string, number]>([
    ["unknown_col > 1", 0],
    ["qty > 1 AND uint_price > 0", 12],
    ["unit-cost > 1", 0], // needs quotes: "unit-cost"
    ["\"unit-cost\" > 1 AND \"Qty\" > 1", 20],
    ["frobnicate(qty) > 1", 0],
    ["abs() > 1", 4],
    ["abs(qty, 2) > 1", 9],
    ["round(qty, 1, 2) > 1", 14],
    ["substr(country) = 'x'", 14],
    ["abs(country) > 1", 4],
    ["abs(*) > 1", 4],
    ["qty + 1", 0], // not a condition
    ["country", 0],
    ["NULL", 0],
    ["NOT qty", 4],
    ["qty AND ok", 0],
    ["ok OR country", 6],
    ["country + 'x' = 'y'", 8], // + does not join text
    ["qty = ship_date", 4],
    ["qty IN (1, DATE '2026-01-01')", 11],
    ["qty IS TRUE", 0],
    ["country LIKE 'a' ESCAPE 'ab'", 24],
    ["country LIKE 'a!x' ESCAPE '!'", 15], // at the escape character,
    ["CASE WHEN qty > 1 THEN 1 ELSE 'x' END = 1", 30],
    ["CASE WHEN qty THEN 1 END = 1", 10],
    ["-country = 'x'", 1],
    ["count() > 1", 0],
  ])("%j fails at %i", (source, offset) => {
    expect(errorOffset(source, env)).toBe(offset);
  });
  test("the failing result carries a message", () => {
    const r = compileExpression("qty > 1 AND (unit_price < 3", env);
    expect(r).toMatchObject({ ok: false, offset: 27 });
    if (!r.ok) expect(r.message.length).toBeGreaterThan(0);
  });
  test("the same expressions compile when written correctly", () => {
    for (const s of ['"unit-cost" > 1', "qty IS NULL", "ok IS TRUE", "ok", "NOT ok", "country || 'x' = 'y'", "CASE WHEN qty > 1 THEN 1 ELSE 2 END = 1", "country LIKE 'a!%' ESCAPE '!'"]) {
      expect(errorOffset(s, env)).toBe("ok");
    }
  });
});

describe("limits against hostile contracts", () => {
  test("deep nesting is refused at the first level too deep, not by a stack overflow", () => {
    expect(errorOffset("(".repeat(1000) + "qty > 1" + ")".repeat(1000), env)).toBe(64);
    expect(errorOffset("NOT ".repeat(500) + "ok", env)).toBe(64 * 4);
    expect(errorOffset("qty IN (".repeat(100) + "1" + ")".repeat(100), env)).toBe(64 * 8 + 7); // the 65th list's "("
    expect(errorOffset("(".repeat(60) + "qty > 1" + ")".repeat(60), env)).toBe("ok");
  });
  test("an overlong expression is refused at the limit", () => {
    expect(errorOffset(`qty > 1${" OR qty > 1".repeat(500)}`, env)).toBe(4000);
    expect(errorOffset(`qty > 1${" OR qty > 1".repeat(300)}`, env)).toBe("ok");
  });
});

describe("IS DISTINCT FROM types", () => {
  test("incomparable sides fail at the right-hand side", () => {
    expect(errorOffset("qty IS DISTINCT FROM ship_date", env)).toBe(21);
    expect(errorOffset("qty IS NOT DISTINCT FROM 3", env)).toBe("ok");
  });
});
