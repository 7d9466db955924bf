import { execFileSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { createRequire } from "node:module";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { Ajv2020 } from "ajv/dist/2020.js";
import addFormats from "ajv-formats";
import { afterAll, describe, expect, test } from "vitest";
import type { DeliveryReport } from "../../src/report/model.js";
import { SARIF_RESULT_CAP, sarif } from "../../src/report/sarif.js";
import { bulk, ctx, returns, sales } from "./fixture.js";
import { expectGolden } from "./golden.js";

interface SarifResult {
  ruleId: string;
  ruleIndex: number;
  level: string;
  message: { text: string };
  locations: { physicalLocation: { artifactLocation: { uri: string; uriBaseId: string }; region: Record<string, number> } }[];
  relatedLocations?: { physicalLocation: { artifactLocation: { uri: string }; region: { startLine: number } } }[];
  partialFingerprints: Record<string, string>;
  properties: Record<string, unknown>;
}
interface SarifRun {
  tool: { driver: { rules: { id: string; help: { text: string }; defaultConfiguration: { level: string } }[] } };
  columnKind: string;
  results: SarifResult[];
  invocations: { executionSuccessful: boolean; toolExecutionNotifications?: { descriptor: { id: string } }[] }[];
  properties: { resultCap: number; resultsOmitted: number; findingsTotal: number };
}
const parse = (reports: readonly DeliveryReport[]): { runs: SarifRun[] } => JSON.parse(sarif(reports, ctx)) as { runs: SarifRun[] };

const require = createRequire(import.meta.url);
const multitoolDir = dirname(require.resolve("@microsoft/sarif-multitool-linux/package.json"));
// The SARIF 2.1.0 schema as the SARIF SDK ships it in its npm package (same definitions as
// oasis-tcs/sarif-spec Schemata/sarif-schema-2.1.0.json, with a draft 2020-12 header).
const schema = JSON.parse(readFileSync(join(multitoolDir, "sarif-2.1.0.json"), "utf8").replace(/^\uFEFF/, "")) as object;
const ajv = new Ajv2020({ allErrors: true, strict: false });
addFormats.default(ajv);
const validateSarif = ajv.compile(schema);

const work = mkdtempSync(join(tmpdir(), "tablegate-sarif-"));
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe("sarif against the SARIF 2.1.0 JSON schema", () => {
  test.each([
    ["failing and passing deliveries", [sales, returns]],
    ["no deliveries", []],
    ["capped run", [bulk(SARIF_RESULT_CAP + 5, 3)]],
    ["truncated findings", [bulk(50, 0, 10)]],
  ] as const)("%s", (_name, reports) => {
    const ok = validateSarif(JSON.parse(sarif(reports, ctx)));
    expect(validateSarif.errors ?? []).toEqual([]);
    expect(ok).toBe(true);
  });

  test("the schema catches a broken log (the validator can fail)", () => {
    const log = JSON.parse(sarif([sales], ctx)) as { runs: { results: { level: string }[] }[] };
    const first = log.runs[0]?.results[0];
    if (first !== undefined) first.level = "fatal";
    expect(validateSarif(log)).toBe(false);
  });
});

const multitool = join(multitoolDir, "Sarif.Multitool");
describe.skipIf(!existsSync(multitool))("sarif with the SARIF multitool validate command", () => {
  // Everything the multitool may still say, and why we accept it (@microsoft/sarif-multitool 5.7.0 rules):
  const accepted: Record<string, string> = {
    SARIF2002: "message ids/arguments: plain text is what code-scanning viewers show",
    SARIF2003: "versionControlProvenance: a pure writer does not know the commit; the upload step records it",
    SARIF2005: "informationUri: the tool has no published home page and the URI must be absolute, so it is left out rather than invented",
    SARIF2009: "rule id style like CS2001: our ids are the check ids of the contract language (SPEC 1.2), which users already know",
    SARIF2010: "region snippet: the raw record could hold sensitive cells, which must never be printed",
    SARIF2011: "contextRegion: same reason as the snippet",
    SARIF2012: "helpUri: must be absolute; no page exists to point at, help.text carries the explanation",
    SARIF2013: "embedded file content: deliveries can be large and hold sensitive cells",
  };

  test("no errors, and only the warnings and notes we can justify", () => {
    const input = join(work, "report.sarif");
    const output = join(work, "validation.sarif");
    const config = join(work, "config.xml");
    writeFileSync(input, sarif([sales, returns], ctx));
    // SARIF2006 fetches every URI over HTTP; tests stay off the network, so it is turned off.
    writeFileSync(
      config,
      '<?xml version="1.0" encoding="utf-8"?>\n<Properties>\n  <Properties Key="SARIF2006.UrisShouldBeReachable.Options">\n    <Property Key="RuleEnabled" Value="Disabled" Type="Driver.RuleEnabledState" />\n  </Properties>\n</Properties>\n',
    );
    execFileSync(multitool, ["validate", input, "-o", output, "-c", config, "--rule-kind", "Sarif;Gh", "--level", "Error;Warning;Note", "--log", "ForceOverwrite"], {
      stdio: "pipe",
      timeout: 120_000,
    });
    const log = JSON.parse(readFileSync(output, "utf8").replace(/^\uFEFF/, "")) as { runs: { results?: { ruleId: string; level?: string }[] }[] };
    const said = log.runs.flatMap((r) => r.results ?? []);
    expect(said.filter((r) => r.level === "error")).toEqual([]);
    const unexplained = said.filter((r) => !(r.ruleId.split("/")[0]! in accepted));
    expect(unexplained).toEqual([]);
    // The multitool ran its rules: the known notes do show up.
    expect(said.some((r) => r.ruleId.startsWith("SARIF2005"))).toBe(true);
  });
});

describe("sarif content", () => {
  const run = parse([sales, returns]).runs[0]!;

  test("one result per finding, placed on the delivery line relative to %SRCROOT%", () => {
    expect(run.results).toHaveLength(sales.findings.length);
    expect(run.columnKind).toBe("utf16CodeUnits");
    const discount = run.results.filter((r) => r.ruleId === "discount.max");
    expect(discount.map((r) => r.locations[0]!.physicalLocation.region.startLine)).toEqual([18, 231, 4104]);
    for (const r of run.results) {
      expect(r.locations[0]!.physicalLocation.artifactLocation).toEqual({ uri: "deliveries/dealer-sales/w48.csv", uriBaseId: "%SRCROOT%" });
      // A CSV column is not a character column: no startColumn.
      expect(Object.keys(r.locations[0]!.physicalLocation.region)).toEqual(["startLine"]);
      expect(run.tool.driver.rules[r.ruleIndex]!.id).toBe(r.ruleId);
    }
  });

  test("whole-file findings sit on line 1; every result points at its contract line", () => {
    const group = run.results.find((r) => r.ruleId === "group:invoice-total")!;
    expect(group.locations[0]!.physicalLocation.region.startLine).toBe(1);
    expect(group.relatedLocations?.[0]?.physicalLocation.artifactLocation.uri).toBe("contracts/dealer-sales.contract.yaml");
    expect(group.relatedLocations?.[0]?.physicalLocation.region.startLine).toBe(34);
    const rule = run.tool.driver.rules.find((r) => r.id === "discount.max")!;
    expect(rule.help.text).toContain("line 22");
    expect(rule.defaultConfiguration.level).toBe("error");
  });

  test("rules cover every check of both contracts, passing ones included", () => {
    const ids = run.tool.driver.rules.map((r) => r.id);
    expect(ids).toEqual([...sales.checks.map((c) => c.rule), ...returns.checks.map((c) => c.rule)]);
  });

  test("column, value and expected travel in properties; masked values stay masked", () => {
    const contact = run.results.find((r) => r.ruleId === "contact.format")!;
    expect(contact.properties).toMatchObject({ column: "contact", row: 512, value: "d***@***.example", expected: "email" });
  });

  test("fingerprints are unique and do not depend on line or row numbers", () => {
    const fps = run.results.map((r) => r.partialFingerprints["tablegateFinding/v1"]);
    expect(new Set(fps).size).toBe(fps.length);
    const shifted: DeliveryReport = {
      ...sales,
      findings: sales.findings.map((f) => ({ ...f, ...(f.row === undefined ? {} : { row: f.row + 7 }), ...(f.line === undefined ? {} : { line: f.line + 9 }) })),
    };
    const moved = parse([shifted]).runs[0]!.results.map((r) => r.partialFingerprints["tablegateFinding/v1"]);
    expect(moved).toEqual(fps);
    const otherValue: DeliveryReport = { ...sales, findings: sales.findings.map((f, i) => (i === 1 ? { ...f, value: "0.95" } : f)) };
    expect(parse([otherValue]).runs[0]!.results[1]!.partialFingerprints["tablegateFinding/v1"]).not.toBe(fps[1]);
  });

  test("the cap keeps the most severe results and states itself", () => {
    const log = parse([bulk(SARIF_RESULT_CAP + 5, 3)]).runs[0]!;
    expect(log.results).toHaveLength(SARIF_RESULT_CAP);
    expect(log.results.every((r) => r.level === "error")).toBe(true);
    expect(log.properties).toMatchObject({ resultCap: SARIF_RESULT_CAP, resultsOmitted: 8, findingsTotal: SARIF_RESULT_CAP + 8 });
    expect(log.invocations[0]!.toolExecutionNotifications?.map((n) => n.descriptor.id)).toEqual(["results-capped"]);
  });

  test("findings cut by the engine are stated", () => {
    const log = parse([bulk(50, 0, 10)]).runs[0]!;
    expect(log.results).toHaveLength(10);
    expect(log.invocations[0]!.toolExecutionNotifications?.map((n) => n.descriptor.id)).toEqual(["findings-truncated"]);
    expect(parse([sales]).runs[0]!.invocations[0]!.toolExecutionNotifications).toBeUndefined();
  });

  test("deterministic, and elapsed time stays out", () => {
    const a = sarif([sales, returns], ctx);
    expect(sarif([sales, returns], ctx)).toBe(a);
    expect(sarif([{ ...sales, elapsed_ms: 999_999 }, returns], ctx)).toBe(a);
    expectGolden("report.sarif", a);
  });
});
