/**
 * lookup() gives a registry cell as its declared column type: SPEC §1.3 says dates compare as dates and
 * date minus date is a number of days, and a table's `columns:` declares which cells are dates,
 * integers, decimals or booleans.
 */
import { describe, expect, it } from "vitest";
import type { DeliveryReport } from "../../src/report/model.js";
import { tablegate, tempRepo } from "./helpers.js";

// Invented data: an outdoor-gear wholesaler's product categories.
const FILES: Record<string, string> = {
  "reference/registry.yaml": `tables:
  gear-categories:
    file: gear-categories.csv
    key: code
    version: "2026.1"
    columns: { code: text, introduced: date, max_lines: integer, duty: decimal, taxable: boolean }
`,
  "reference/gear-categories.csv": "code,introduced,max_lines,duty,taxable\nTENT,2019-03-01,40,0.05,true\nGIFT,2023-11-01,5,0.10,false\n",
  "c.yaml": `tablegate: 1
name: category-sales
columns:
  category: { type: text }
  sold_on: { type: date }
  lines: { type: integer }
  duty_paid: { type: decimal }
  taxed: { type: boolean }
rules:
  - id: thirty-days-after-intro
    assert: sold_on - lookup('gear-categories', category, 'introduced') >= 30
  - id: intro-plus-thirty
    assert: lookup('gear-categories', category, 'introduced') + 30 <= sold_on
  - id: line-limit
    assert: lines <= lookup('gear-categories', category, 'max_lines') * 1
  - id: duty-rate
    assert: duty_paid = lookup('gear-categories', category, 'duty')
  - id: tax-flag
    assert: taxed = lookup('gear-categories', category, 'taxable')
`,
  // 2019-03-15 is 14 days after 2019-03-01; 2019-04-01 is 31; 2023-12-01 is 30 days after 2023-11-01.
  "d.csv": "category,sold_on,lines,duty_paid,taxed\nTENT,2019-03-15,41,0.05,true\nTENT,2019-04-01,40,0.050,false\nGIFT,2023-12-01,6,0.1,false\n",
};


describe("lookup() of typed registry columns", () => {
  it("does date arithmetic, numbers and booleans on the looked-up cells", async () => {
    const root = await tempRepo(FILES);
    expect((await tablegate(root, "ref", "lock")).code).toBe(0);
    const r = await tablegate(root, "check", "d.csv", "--contract", "c.yaml", "--report", "json=-");
    const report = JSON.parse(r.out) as DeliveryReport;
    const rows = (rule: string) => report.findings.filter((f) => f.rule === rule).map((f) => f.row);
    expect({
      days: rows("rule:thirty-days-after-intro"),
      plus: rows("rule:intro-plus-thirty"),
      lines: rows("rule:line-limit"),
      duty: rows("rule:duty-rate"),
      tax: rows("rule:tax-flag"),
    }).toEqual({ days: [1], plus: [1], lines: [1, 3], duty: [], tax: [2] });
  });
});
