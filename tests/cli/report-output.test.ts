/**
 * SPEC §4: the JSON report is deterministic (same inputs, same bytes apart from an optional
 * elapsed_ms) and follows the report JSON Schema shipped beside the contract schema, checked here with
 * ajv's draft 2020-12 validator (ajv-formats for format keywords).
 */
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { Ajv2020 } from "ajv/dist/2020.js";
import addFormatsModule from "ajv-formats";
import { describe, expect, it } from "vitest";
import { runCli } from "../helpers/cli.js";

const here = dirname(fileURLToPath(import.meta.url));
const schemaFile = join(here, "../../src/schema/report.schema.json");
const goldenDir = join(here, "../golden");
const goldenCases = readdirSync(goldenDir, { withFileTypes: true })
  .filter((d) => d.isDirectory() && existsSync(join(goldenDir, d.name, "expected.json")))
  .map((d) => d.name)
  .sort();

/** The golden case's files, its data file always named data.csv (the contract names the format). */
function filesOf(name: string): Record<string, Uint8Array> {
  const data = readdirSync(join(goldenDir, name)).find((f) => f.startsWith("data.")) ?? "data.csv";
  return {
    "contract.yaml": readFileSync(join(goldenDir, name, "contract.yaml")),
    "data.csv": readFileSync(join(goldenDir, name, data)),
  };
}

const withoutElapsed = (s: string) => s.replace(/"elapsed_ms":\s*[0-9.eE+-]+,?/g, "");

describe("deterministic output", () => {
  for (const format of ["json", "text", "sarif", "junit", "codequality"]) {
    it(`${format}: two runs over the same inputs give the same bytes`, async () => {
      const files = filesOf("13-width-quoted-newlines");
      const argv = ["check", "data.csv", "--contract", "contract.yaml", "--report", `${format}=-`];
      const a = await runCli(argv, files);
      const b = await runCli(argv, files);
      expect(a.code).toBe(1);
      expect(a.stdout.length).toBeGreaterThan(0);
      expect(withoutElapsed(b.stdout)).toBe(withoutElapsed(a.stdout));
    });
  }
});

describe("JSON report against src/schema/report.schema.json", () => {
  const schema = JSON.parse(readFileSync(schemaFile, "utf8")) as object;
  const ajv = new Ajv2020({ allErrors: true, strict: false });
  // ajv-formats ships CommonJS; its default export arrives wrapped or bare depending on the loader.
  const addFormats = ((addFormatsModule as unknown as { default?: unknown }).default ?? addFormatsModule) as (a: Ajv2020) => Ajv2020;
  addFormats(ajv);
  const validate = ajv.compile(schema);

  it("the schema is a draft 2020-12 schema", () => {
    expect((schema as { $schema?: string }).$schema).toBe("https://json-schema.org/draft/2020-12/schema");
  });

  for (const name of goldenCases) {
    it(`golden ${name}`, async () => {
      const r = await runCli(["check", "data.csv", "--contract", "contract.yaml", "--report", "json=-"], filesOf(name));
      const report = JSON.parse(r.stdout) as unknown;
      validate(report);
      expect(validate.errors ?? []).toEqual([]);
    });
  }

  it("several deliveries in one run", async () => {
    const files = { ...filesOf("02-integer"), "second.csv": readFileSync(join(goldenDir, "02-integer", "data.csv")) };
    const r = await runCli(["check", "data.csv", "second.csv", "--contract", "contract.yaml", "--report", "json=-"], files);
    const report = JSON.parse(r.stdout) as unknown;
    validate(report);
    expect(validate.errors ?? []).toEqual([]);
  });

  it("a report the schema must reject (verdict misspelt) is rejected", () => {
    expect(validate({ report: 1, verdict: "passed" })).toBe(false);
  });
});

