import { describe, expect, it } from "vitest";
import { compileContract } from "../../src/contract/load.js";
import { parseYamlSource } from "../../src/contract/yaml-source.js";
import { compareFindings, expandReaders, lookupOffsets, tableReaders } from "../../src/registry/impact.js";
import { loadRegistry } from "../../src/registry/index.js";
import type { DeliveryReport, Finding } from "../../src/report/model.js";
import { tempRepo } from "./helpers.js";

describe("lookupOffsets", () => {
  it("finds lookup calls on the table in the syntax tree, at their offsets", () => {
    expect(lookupOffsets("region = lookup('us-states', state, 'region')", "us-states")).toEqual([9]);
    // nested in CASE, written in capitals, twice
    const src = "CASE WHEN LOOKUP('us-states', s, 'region') = 'West' THEN 1 ELSE length(lookup('us-states', t, 'name')) END > 0";
    expect(lookupOffsets(src, "us-states")).toEqual([10, src.indexOf("lookup(")]);
  });

  it("does not count the name inside another string, another table, or an unparsable expression", () => {
    expect(lookupOffsets("note <> 'lookup(''us-states'', x, ''y'')'", "us-states")).toEqual([]);
    expect(lookupOffsets("region = lookup('ca-provinces', state, 'name')", "us-states")).toEqual([]);
    expect(lookupOffsets("lookup('us-states', state, 'region') =", "us-states")).toEqual([]);
    expect(lookupOffsets("matches(x, 'us-states')", "us-states")).toEqual([]);
  });
});

const CONTRACT = `tablegate: 1
name: dealer-orders
columns:
  state: { type: text, codes: { table: us-states, column: code } }
  region: { type: text, when: "lookup('us-states', state, 'region') IS NOT NULL", codes: [West, South] }
  country: { type: text, codes: { table: iso-3166-1, column: alpha2 } }
rules:
  - id: region-right
    assert: region = lookup('us-states', state, 'region')
  - id: only-when
    when: lookup('us-states', state, 'code') IS NOT NULL
    assert: region IS NOT NULL
  - id: unrelated
    assert: "country <> 'lookup(''us-states'''"
groups:
  - id: one-region
    by: [state]
    assert: count() >= 1 AND first(lookup('us-states', state, 'region')) IS NOT NULL
`;

describe("tableReaders", () => {
  it("lists codes, a column's when, rule assert and when, and group assert, each at its YAML line", () => {
    const readers = tableReaders(parseYamlSource("c.yaml", CONTRACT), "us-states");
    expect(readers.map((r) => [r.via, r.rules, r.column, r.line])).toEqual([
      ["codes", ["state.codes"], "state", 4],
      ["when", ["region.*"], "region", 5],
      ["assert", ["rule:region-right"], undefined, 9],
      ["when", ["rule:only-when"], undefined, 11],
      ["assert", ["group:one-region"], undefined, 18],
    ]);
    // the column of the rule's lookup call, not of the YAML value's start
    expect(readers[2]?.col).toBe(CONTRACT.split("\n")[8]!.indexOf("lookup(") + 1);
    expect(tableReaders(parseYamlSource("c.yaml", CONTRACT), "iso-3166-1").map((r) => r.rules)).toEqual([["country.codes"]]);
    expect(tableReaders(parseYamlSource("c.yaml", CONTRACT), "ca-provinces")).toEqual([]);
  });

  it("expands a column's when to every check the plan made for that column", async () => {
    const reg = await loadRegistry(await tempRepo({}));
    if (!reg.ok) throw new Error("built-in registry did not load");
    const plan = compileContract("c.yaml", CONTRACT, { registry: reg.value });
    if (!plan.ok) throw new Error(plan.problems.map((p) => p.message).join("; "));
    const when = expandReaders(tableReaders(parseYamlSource("c.yaml", CONTRACT), "us-states"), plan.value).find((r) => r.column === "region");
    expect([...(when?.rules ?? [])].sort()).toEqual(["region.codes", "region.required", "region.spaces", "region.type"]);
  });
});

function report(findings: Finding[]): DeliveryReport {
  return {
    report: 1,
    tool: { name: "tablegate", version: "0" },
    contract: { name: "c", path: "c.yaml", sha256: "" },
    input: { path: "d.csv", sha256: "", bytes: 0, rows: 9, format: "csv", encoding: "utf-8" },
    references: [],
    verdict: findings.length > 0 ? "fail" : "pass",
    counts: { error: findings.length, warning: 0, note: 0, rows_failed: findings.length },
    checks: [],
    findings,
    truncated: false,
  };
}

const f = (rule: string, row: number, column: string, message = "m"): Finding => ({ rule, level: "error", row, line: row + 1, column, value: "v", message });

describe("compareFindings", () => {
  it("reports findings of the given checks present on one side only; same check, row and column match whatever the message", () => {
    const locked = report([f("state.codes", 1, "state"), f("state.codes", 4, "state"), f("rule:r", 2, "region", "before"), f("qty.min", 3, "qty")]);
    const working = report([f("state.codes", 1, "state"), f("state.codes", 5, "state"), f("rule:r", 2, "region", "after"), f("rule:r", 3, "region"), f("qty.min", 7, "qty")]);
    const d = compareFindings(locked, working, new Set(["state.codes", "rule:r"]));
    expect(d.failsNow.map((c) => [c.rule, c.row, c.line])).toEqual([["rule:r", 3, 4], ["state.codes", 5, 6]]);
    expect(d.passesNow.map((c) => [c.rule, c.row])).toEqual([["state.codes", 4]]);
  });
});
