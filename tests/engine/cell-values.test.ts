/**
 * Cells padded with spaces.
 * - SPEC §4 `value` is the cell's value (the example shows "0.9"), not a quoted rendering of it.
 * - SPEC §1.1: "A cell that fails to parse as its type is one finding (<column>.type) and its other
 *   checks are skipped", spaces included.
 * - SPEC §1.1: "a cell whose raw text had leading or trailing spaces is also a finding
 *   (<column>.spaces, level warning)": a blank marker written with spaces (" NA ") had spaces too.
 */
import { describe, expect, it } from "vitest";
import { checkJson } from "../helpers/cli.js";
import { expectFinding, expectNoFinding } from "../helpers/findings.js";

const contract = "tablegate: 1\nname: padded\ncolumns:\n  a: { type: integer, min: 5 }\n  b: { type: text }\n";

describe("padded cells", () => {
  it("a finding on a padded cell still passes (sanity: both findings are there)", async () => {
    const { report } = await checkJson(contract, "a,b\n 3,x\n");
    expectFinding(report, { rule: "a.min", row: 1, line: 2, column: "a" });
    expectFinding(report, { rule: "a.spaces", row: 1, line: 2, column: "a", level: "warning" });
  });

  it("value is the cell text (raw or trimmed), not a quoted rendering", async () => {
    const { report } = await checkJson(contract, "a,b\n 3,x\n");
    const f = expectFinding(report, { rule: "a.min", row: 1, line: 2, column: "a" });
    expect([" 3", "3"]).toContain(f.value);
  });

  it("a padded cell that fails its type is one finding: a.type only", async () => {
    const { report } = await checkJson(contract, "a,b\n x ,y\n");
    expectFinding(report, { rule: "a.type", row: 1, line: 2, column: "a", level: "error" });
    expectNoFinding(report, { rule: "a.spaces", row: 1 });
  });

  it("a blank marker written with spaces is a spaces finding besides required; spaces alone are just blank", async () => {
    const c = 'tablegate: 1\nname: m\ninput:\n  blank: ["", "NA"]\ncolumns:\n  emp: { type: integer, required: true }\n  n: { type: integer }\n';
    const { report } = await checkJson(c, "emp,n\n NA,1\nNA ,2\n NA ,3\nNA,4\n   ,5\n");
    const rows = (rule: string) => report.findings.filter((f) => f.rule === rule).map((f) => f.row);
    expect({ spaces: rows("emp.spaces"), required: rows("emp.required") }).toEqual({ spaces: [1, 2, 3], required: [1, 2, 3, 4, 5] });
  });
});

describe("long cells", () => {
  // README "Choices": a cell past 1,000 characters shows its first 1,000 and …(+N).
  it("show their first 1,000 characters and how many more, in value and message", async () => {
    const long = "x".repeat(4000) + "END";
    const { report } = await checkJson("tablegate: 1\nname: long\ncolumns:\n  a: { type: integer }\n", `a\n${long}\n`);
    const f = expectFinding(report, { rule: "a.type", row: 1, line: 2, column: "a" });
    expect(f.value).toBe(`${"x".repeat(1000)}…(+3003)`);
    expect(f.message).toContain("…(+3003)");
    expect(f.message).not.toContain("END");
  });

  it("never cut a character that takes two UTF-16 units in half", async () => {
    const long = "x".repeat(999) + "🏕" + "y".repeat(10);
    const { report } = await checkJson("tablegate: 1\nname: long\ncolumns:\n  a: { type: integer }\n", `a\n${long}\n`);
    const f = expectFinding(report, { rule: "a.type", row: 1, line: 2 });
    expect(f.value).toBe(`${"x".repeat(999)}…(+12)`);
  });
});

describe("every space trim removes", () => {
  // ECMA-262 String.prototype.trim removes Unicode Zs spaces and line terminators, U+3000 and U+2028
  // among them; SPEC §1.1 "Cells are trimmed before every check": such a cell is its value, padded.
  it.each([["\u3000"], ["\u2028"], ["\u00a0"], ["\ufeff"], ["\u2003"]])("a cell padded with %j is trimmed and a spaces finding", async (pad) => {
    const { report } = await checkJson("tablegate: 1\nname: pad\ncolumns:\n  a: { type: integer, codes: [7] }\n", `a\n${pad}7${pad}\n`);
    expect(report.findings.map((f) => f.rule)).toEqual(["a.spaces"]);
  });
});
