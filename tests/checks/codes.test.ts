/**
 * `codes` (SPEC §1.1): the trimmed text must be one of an inline list, or one of the values of a
 * registry table column. Comparison is on the text as delivered, case-sensitive.
 */
import { describe, expect, it } from "vitest";
import { compileContract } from "../../src/contract/load.js";
import type { ColumnSpec } from "../../src/contract/types.js";
import { loadRegistry } from "../../src/registry/index.js";
import { checkJson, runCli } from "../helpers/cli.js";
import { compiled, fakeContext, judge, passes, specErrors } from "./helpers.js";

describe("inline codes", () => {
  const spec: ColumnSpec = { type: "text", codes: ["NORTHEAST", "MIDWEST", "SOUTH", "WEST"] };
  it("listed values pass, anything else misses, case matters", () => {
    const check = compiled("codes", spec);
    expect(["WEST", "SOUTH", "west", "EAST", "WEST "].map((t) => judge(check, spec, t) === undefined)).toEqual([true, true, false, false, false]);
  });

  // A typed column's codes are values of its type, compared as keys compare them (as a SQL IN list over
  // an INTEGER column compares values: 01 = 1; ISO/IEC 9075 comparison of exact numerics).
  it("numbers in the list compare as numbers in a numeric column", () => {
    const nums: ColumnSpec = { type: "integer", codes: [1, 2, 10] };
    const check = compiled("codes", nums);
    expect(["1", "2", "10", "3", "01", "+1"].map((t) => [t, judge(check, nums, t) === undefined])).toEqual([
      ["1", true],
      ["2", true],
      ["10", true],
      ["3", false],
      ["01", true],
      ["+1", true],
    ]);
  });

  it("a decimal column's codes match by value, whether written as text or as numbers", () => {
    expect(passes("codes", { type: "decimal", codes: ["0.5", "1.5"] }, "1.5")).toBe(true);
    expect(passes("codes", { type: "decimal", codes: ["0.5", "1.5"] }, "1.50")).toBe(true);
    expect(passes("codes", { type: "decimal", codes: [0.5, 1] }, "1.0")).toBe(true);
    expect(passes("codes", { type: "decimal", codes: [0.5, 1] }, "0.51")).toBe(false);
  });

  it("a date column's codes are ISO 8601 dates, matched whatever format the cell uses", () => {
    const dates: ColumnSpec = { type: "date", format: "%d/%m/%Y", codes: ["2026-12-24", "2026-12-31"] };
    expect(passes("codes", dates, "24/12/2026")).toBe(true);
    expect(passes("codes", dates, "25/12/2026")).toBe(false);
  });

  it("a code that is no value of the column's type is a contract error at its place", () => {
    expect(specErrors("codes", { type: "integer", codes: [1, "A1"] }).map((e) => e.path)).toEqual([["codes", 1]]);
    expect(specErrors("codes", { type: "date", codes: ["24/12/2026"] }).map((e) => e.path)).toEqual([["codes", 0]]);
  });

  it("a one-code list and repeats in the list work", () => {
    expect(passes("codes", { type: "text", codes: ["A", "A"] }, "A")).toBe(true);
    expect(passes("codes", { type: "text", codes: ["A"] }, "B")).toBe(false);
  });

  // Bug (or at least a surprise the README does not state): YAML turns `2.50` into the number 2.5 before
  // the list is read, so a delivery writing the code exactly as the contract does is refused.
  it("a number written 2.50 in the contract's list accepts the cell 2.50", () => {
    const registry = { table: () => undefined, tables: () => [] };
    const r = compileContract("c.contract.yaml", "tablegate: 1\nname: c\ncolumns:\n  size: { type: decimal, codes: [2.50, 3.00] }\n", { registry });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const col = r.value.columns[0];
    const value = col?.parse("2.50") ?? null;
    expect((col?.cellChecks ?? []).map((c) => c.test(value, "2.50", { values: [], texts: [] }))).toEqual([undefined]);
  });
});

describe("registry codes through ctx.codeSet", () => {
  const calls: [string, string][] = [];
  const ctx = fakeContext({
    codeSet: (table, column) => {
      calls.push([table, column]);
      if (table !== "regions") return { field: "table", message: `no table ${table}` };
      if (column !== "code") return { field: "column", message: `no column ${column}` };
      return new Set(["N", "S", "E", "W"]);
    },
  });

  it("asks for the named table column once, at compile time, and tests membership", () => {
    calls.length = 0;
    const spec: ColumnSpec = { type: "text", codes: { table: "regions", column: "code" } };
    const check = compiled("codes", spec, ctx);
    expect(calls).toEqual([["regions", "code"]]);
    expect(["N", "W", "X", "n"].map((t) => judge(check, spec, t) === undefined)).toEqual([true, true, false, false]);
    expect(calls).toHaveLength(1);
  });

  it("an unknown table is an error at ['codes', 'table']", () => {
    const errors = specErrors("codes", { type: "text", codes: { table: "zones", column: "code" } }, ctx);
    expect(errors.map((e) => e.path)).toEqual([["codes", "table"]]);
  });

  it("an unknown column is an error at ['codes', 'column']", () => {
    const errors = specErrors("codes", { type: "text", codes: { table: "regions", column: "name" } }, ctx);
    expect(errors.map((e) => e.path)).toEqual([["codes", "column"]]);
  });
});

describe("registry codes through a compiled contract and the built-in tables", () => {
  it("iso-3166-1 alpha2: US passes, XX misses", async () => {
    const reg = await loadRegistry("/work/main");
    expect(reg.ok).toBe(true);
    if (!reg.ok) return;
    const r = compileContract("c.contract.yaml", "tablegate: 1\nname: c\ncolumns:\n  country: { type: text, codes: { table: iso-3166-1, column: alpha2 } }\n", {
      registry: reg.value,
    });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const tests = r.value.columns[0]?.cellChecks ?? [];
    expect(tests).toHaveLength(1);
    const verdict = (t: string) => tests[0]?.test(t, t, { values: [t], texts: [t] }) === undefined;
    // ISO 3166-1 alpha-2: US, DE and JP are assigned, XX is user-assigned and never a country (from memory).
    expect(["US", "DE", "JP", "XX", "us"].map(verdict)).toEqual([true, true, true, false, false]);
  });
});

describe("registry codes on a typed column", () => {
  it("compare table cells and delivery cells by value", () => {
    const ctx = fakeContext({ codeSet: () => new Set(["5", "10", "n/a"]) });
    const spec: ColumnSpec = { type: "integer", codes: { table: "ship-methods", column: "transit_days" } };
    expect(["5", "05", "10", "7"].map((t) => passes("codes", spec, t, ctx))).toEqual([true, true, true, false]);
  });
});

describe("codes as the contract wrote them", () => {
  // YAML 1.2 reads 9007199254740993 as a number, which a double cannot hold (it becomes ...992,
  // IEEE 754 binary64); the code is the digits written, as integer keys compare digits past 2^53.
  it("an integer code past 2^53 matches its own digits only", async () => {
    const contract = "tablegate: 1\nname: big\ncolumns:\n  id: { type: integer, codes: [9007199254740993, 12345678901234567891] }\n";
    const { report } = await checkJson(contract, "id\n9007199254740993\n9007199254740992\n12345678901234567891\n12345678901234567890\n");
    expect(report.findings.map((f) => `${f.rule}@${f.row}`)).toEqual(["id.codes@2", "id.codes@4"]);
  });

  // SPEC §1.1: a sensitive column's raw values are never printed; its allowed codes are such values.
  it("a sensitive column's list is never printed, in the check or in a finding", async () => {
    const contract = "tablegate: 1\nname: acct\ncolumns:\n  account: { type: text, sensitive: true, codes: [GB29NWBK60161331926819, DE89370400440532013000] }\n";
    const r = await checkJson(contract, "account\nGB29NWBK60161331926819\nFR1420041010050500013M02606\n");
    expect(r.report.findings.map((f) => `${f.rule}@${f.row}`)).toEqual(["account.codes@2"]);
    expect(r.stdout).not.toMatch(/GB29NWBK|DE893704|FR142004/);
    const every = ["text", "sarif", "junit", "github", "codequality", "html"].flatMap((f) => ["--report", `${f}=-`]);
    const all = await runCli(["check", "data.csv", "--contract", "contract.yaml", ...every], { "contract.yaml": contract, "data.csv": "account\nGB29NWBK60161331926819\nFR1420041010050500013M02606\n" });
    expect(all.code).toBe(1);
    expect(all.stdout.length).toBeGreaterThan(1000);
    expect(all.stdout).not.toMatch(/GB29NWBK|DE893704|FR142004/);
  });
});
