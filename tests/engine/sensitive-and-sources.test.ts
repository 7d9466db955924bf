/**
 * SPEC §1.1 `sensitive`: the raw value never appears in any output; SPEC §4 `checks[].source`: the
 * contract line that declared the check.
 */
import { describe, expect, it } from "vitest";
import { checkJson, runCli } from "../helpers/cli.js";
import { checkOf, expectFinding } from "../helpers/findings.js";

const sensitive = [
  "tablegate: 1",
  "name: contacts",
  "columns:",
  "  id: { type: integer }",
  "  contact: { type: text, sensitive: true, format: email }",
  "  card: { type: text, sensitive: true, pattern: '^[0-9]{16}$' }",
  "keys: [contact]",
  "rules:",
  "  - id: card-present",
  "    assert: card IS NOT NULL AND length(card) = 16",
  "",
].join("\n");
// Invented values; each must stay hidden wherever it fails a check.
const data = "id,contact,card\n1,kestrel.ridge@example.org,4000123412341234\n2,kestrel.ridge@example.org,4000-1234-1234-9999\n3,not an address,12345\n";
const secrets = ["kestrel.ridge", "4000-1234-1234-9999", "not an address", "12345"];

describe("sensitive columns", () => {
  it("findings carry a masked value", async () => {
    const { report } = await checkJson(sensitive, data);
    const f = expectFinding(report, { rule: "card.pattern", row: 2, line: 3, column: "card", level: "error" });
    expect(f.value).toBeDefined();
    expect(f.value).not.toBe("4000-1234-1234-9999");
    expectFinding(report, { rule: "contact.format", row: 3, line: 4, column: "contact", level: "error" });
    expectFinding(report, { rule: "key:contact", row: 2, line: 3, level: "error" });
  });

  for (const format of ["json", "text", "sarif", "junit", "codequality", "github", "html"]) {
    it(`no raw sensitive value in the ${format} report`, async () => {
      const r = await runCli(["check", "d.csv", "--contract", "c.yaml", "--report", `${format}=-`], { "c.yaml": sensitive, "d.csv": data });
      expect(r.code).toBe(1);
      expect(r.stdout.length).toBeGreaterThan(0);
      for (const s of secrets) expect(r.stdout + r.stderr, `${format} shows ${s}`).not.toContain(s);
    });
  }
});

describe("sensitive columns in groups and outliers", () => {
  // A group's aggregates over a sensitive column (first, max, a one-row sum) are that column's values,
  // and an outlier's fences or median can be one of them too.
  const contract = [
    "tablegate: 1",
    "name: pay",
    "columns:",
    "  dept: { type: text }",
    "  full_name: { type: text, sensitive: true }",
    "  salary: { type: decimal, sensitive: true }",
    "groups:",
    "  - id: capped",
    "    by: [dept]",
    "    assert: max(salary) < 5000 AND first(full_name) = 'nobody' AND sum(salary) < 1",
    "outliers:",
    "  - { column: salary, method: mad, threshold: 1 }",
    "",
  ].join("\n");
  const data = "dept,full_name,salary\nA,Tamsin Ashgrove,7123.45\nB,Orrin Fell,4100.10\nB,Ivo Marsh,4100.20\nB,Lark Penn,4100.30\nB,Wren Holt,9999.99\n";
  const secrets = ["Tamsin", "Ashgrove", "7123.45", "4100.2", "9999.99"];

  for (const format of ["json", "text", "sarif", "junit", "codequality", "github", "html"]) {
    it(`no raw sensitive value in the ${format} report`, async () => {
      const r = await runCli(["check", "d.csv", "--contract", "c.yaml", "--report", `${format}=-`], { "c.yaml": contract, "d.csv": data });
      expect(r.code).toBe(1);
      for (const s of secrets) expect(r.stdout + r.stderr, `${format} shows ${s}`).not.toContain(s);
    });
  }
});

describe("checks[].source", () => {
  const contract = [
    "tablegate: 1", //        1
    "name: sources", //       2
    "columns:", //            3
    "  qty:", //              4
    "    type: integer", //   5
    "    min: 1", //          6
    "    max: 99", //         7
    "rules:", //              8
    "  - id: r1", //          9
    "    assert: qty < 50", // 10
    "keys:", //               11
    "  - qty", //             12
    "",
  ].join("\n");

  it("points at the contract line that declared each check", async () => {
    const { report } = await checkJson(contract, "qty\n0\n60\n60\n");
    const line = (rule: string) => report.checks.find((c) => c.rule === rule)?.source?.line;
    expect({
      min: line("qty.min"),
      max: line("qty.max"),
      type: line("qty.type"),
      key: line("key:qty"),
    }).toEqual({ min: 6, max: 7, type: 5, key: 12 });
    // The rule is declared by its list entry (line 9) or its assert (line 10).
    expect([9, 10]).toContain(line("rule:r1"));
    expect(checkOf(report, "rule:r1").failed).toBe(2);
    expect(checkOf(report, "key:qty").failed).toBe(1);
  });
});
