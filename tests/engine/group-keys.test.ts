/**
 * Groups form on typed values, as SQL GROUP BY over typed columns does (ISO/IEC 9075: rows whose
 * grouping values are equal belong to one group, and equality of INTEGER or DATE values is by value),
 * and as keys compare: `01001` and `1001` in an integer column are one employee.
 */
import { describe, expect, it } from "vitest";
import { checkJson, runCli } from "../helpers/cli.js";

const failedOf = (report: { checks: readonly { rule: string; failed: number }[] }, rule: string) => report.checks.find((c) => c.rule === rule)?.failed;

describe("group keys", () => {
  const payroll = [
    "tablegate: 1",
    "name: payroll",
    "columns:",
    "  employee_no: { type: integer }",
    '  pay_date: { type: date, format: ["%Y-%m-%d", "%d/%m/%Y"] }',
    "  gross: { type: decimal }",
    "  period_gross: { type: decimal }",
    "groups:",
    "  - id: balance",
    "    by: [employee_no]",
    "    assert: sum(gross) = first(period_gross)",
    "  - id: runs",
    "    by: [pay_date]",
    "    assert: count() = 3",
    "",
  ].join("\n");

  it("one group for an integer written 1001 and 01001, and for one date in two formats", async () => {
    const data = "employee_no,pay_date,gross,period_gross\n1001,2026-03-31,2400.00,4150.00\n01001,31/03/2026,1750.00,4150.00\n1002,2026-03-31,2000.00,2000.00\n";
    const { report, code } = await checkJson(payroll, data);
    expect({ code, balance: failedOf(report, "group:balance"), runs: failedOf(report, "group:runs") }).toEqual({ code: 0, balance: 0, runs: 0 });
  });

  it("a failing group is reported on its first row, showing that row's text", async () => {
    const data = "employee_no,pay_date,gross,period_gross\n01001,2026-03-31,2400.00,4150.00\n1001,2026-03-31,1000.00,4150.00\n1002,2026-03-31,2000.00,2000.00\n";
    const { report } = await checkJson(payroll, data);
    const found = report.findings.filter((f) => f.rule === "group:balance");
    expect(found.map((f) => ({ row: f.row, line: f.line, value: f.value }))).toEqual([{ row: 1, line: 2, value: "employee_no=01001" }]);
  });

  it("parts that contain any character, U+001F included, never join into another group's key", async () => {
    const contract = "tablegate: 1\nname: bins\ncolumns:\n  warehouse: { type: text }\n  bin: { type: text }\ngroups:\n  - id: one-line-per-bin\n    by: [warehouse, bin]\n    assert: count() = 1\n";
    for (const sep of ["\u001f", ":", "1:", "\u0000"]) {
      const data = `warehouse,bin\nnorth${sep}A,7\nnorth,A${sep}7\n`;
      const { report, code } = await checkJson(contract, data);
      expect({ sep, code, failed: failedOf(report, "group:one-line-per-bin") }).toEqual({ sep, code: 0, failed: 0 });
    }
  });

  it("a cell that fails its type is NULL and groups with the blank cells, as SQL GROUP BY puts NULLs in one group", async () => {
    const contract = "tablegate: 1\nname: days\ncolumns:\n  day: { type: date }\n  n: { type: integer }\ngroups:\n  - id: one-per-day\n    by: [day]\n    assert: count() = 1\n    level: note\n";
    // 2026-01-01 is day 20454 after 1970-01-01 (Date.UTC(2026, 0, 1) / 86400000).
    expect(Date.UTC(2026, 0, 1) / 86_400_000).toBe(20454);
    const { report } = await checkJson(contract, "day,n\n2026-01-01,1\nd20454,2\n,3\n,4\n");
    const found = report.findings.filter((f) => f.rule === "group:one-per-day");
    // Row 1 is a group alone; rows 2 (not a date), 3 and 4 (blank) are the one NULL group.
    expect(found.map((f) => f.row)).toEqual([2]);
    expect(found[0]?.message).toContain("day=NULL (3 rows, rows 2 to 4)");
  });
});

describe("allow on a group", () => {
  // SPEC §1.5: "the check fails only when more than that share of rows violate it". A failing group's
  // rows are the rows that violate it: 2 failing invoices of 3 and 2 lines in 10 rows are 5 rows, 0.5.
  const contract = (allow: number) =>
    `tablegate: 1\nname: inv\ncolumns:\n  invoice: { type: text }\n  line: { type: integer }\ngroups:\n  - id: numbered\n    by: [invoice]\n    assert: count() = max(line)\n    allow: ${allow}\n`;
  const data = "invoice,line\nA,1\nA,2\nA,4\nB,1\nC,1\nC,3\nD,1\nE,1\nF,1\nG,1\n";

  it("is judged on the rows of the failing groups", async () => {
    const within = await checkJson(contract(0.5), data);
    const beyond = await checkJson(contract(0.49), data);
    const tally = (r: typeof within) => r.report.checks.find((c) => c.rule === "group:numbered");
    expect({ code: within.code, failed: tally(within)?.failed, share: tally(within)?.share }).toEqual({ code: 0, failed: 2, share: 0.5 });
    expect({ code: beyond.code, within: tally(beyond)?.within_allowance }).toEqual({ code: 1, within: false });
  });
});

describe("a group assert names its own by columns bare", () => {
  // ISO/IEC 9075 HAVING: a grouping column has one value per group and may stand outside an aggregate.
  const contract = (assert: string) =>
    `tablegate: 1\nname: g\ncolumns:\n  region: { type: text }\n  amount: { type: integer }\ngroups:\n  - id: cap\n    by: [region]\n    assert: ${assert}\n`;
  const data = "region,amount\nWEST,80\nEAST,60\nWEST,70\nEAST,30\nNORTH,200\n";

  it("as the group's value", async () => {
    const { report } = await checkJson(contract("region = 'WEST' OR sum(amount) <= 100"), data);
    // WEST (150) is excused by its name, EAST sums to 90, NORTH to 200.
    expect(report.findings.filter((f) => f.rule === "group:cap").map((f) => f.row)).toEqual([5]);
  });

  it("but a column the group is not formed by is still a contract error at its position", async () => {
    const r = await runCli(["lint", "contract.yaml"], { "contract.yaml": contract("amount > 0") });
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^tablegate: contract\.yaml:9:13: /);
    expect(r.stderr.trim().split("\n")).toHaveLength(1);
  });
});
