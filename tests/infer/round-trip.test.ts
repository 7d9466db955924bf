/**
 * A draft inferred from a file accepts that file: the contract compiles (compileContract, with the
 * repository's registry) and `check` of the same file against it exits 0. Run on the demo's clean
 * sample and on the csv-spectrum test files (npm csv-spectrum 2.0.0), an outside collection of CSV edge
 * cases whose json/ folder gives the records each file holds.
 */
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { compileContract } from "../../src/contract/load.js";
import { loadRegistry } from "../../src/registry/index.js";
import type { DeliveryReport } from "../../src/report/model.js";
import { runCli } from "../helpers/cli.js";
import { column, roundTrip } from "./helpers.js";

const repo = join(import.meta.dirname, "..", "..");
const spectrum = join(repo, "node_modules", "csv-spectrum");

async function compiles(text: string): Promise<void> {
  const registry = await loadRegistry(repo);
  if (!registry.ok) throw new Error("the repository registry does not load");
  const compiled = compileContract("draft.contract.yaml", text, { registry: registry.value });
  expect(compiled.ok ? [] : compiled.problems).toEqual([]);
}

describe("the demo's clean sample", () => {
  const sample = readFileSync(join(repo, "contracts", "samples", "dealer-sales-w47.csv"));

  it("compiles, passes check, and agrees with the demo contract where the data decides", async () => {
    const r = await roundTrip(sample, "dealer-sales-w47.csv");
    await compiles(r.infer.stdout);
    expect(r.check.code, r.check.stdout).toBe(0);
    const report = JSON.parse(r.check.stdout) as DeliveryReport;
    expect(report.counts.error).toBe(0);
    const c = r.contract;
    expect(c.name).toBe("dealer-sales-w47");
    expect(c.keys).toEqual([["invoice_no", "line_no"]]);
    // the same decisions as the hand-written contracts/dealer-sales.contract.yaml
    expect(column(c, "line_no")).toMatchObject({ type: "integer", required: true });
    expect(column(c, "invoice_date")).toMatchObject({ type: "date", format: "%Y-%m-%d" });
    expect(column(c, "ship_date").format).toEqual(["%Y-%m-%d", "%m/%d/%Y", "serial-1900"]);
    expect(column(c, "sku").pattern).toBeDefined();
    expect(column(c, "unit_price")).toMatchObject({ type: "decimal", scale: 2 });
    expect(column(c, "discount").type).toBe("decimal");
    expect(column(c, "discount").required).toBeUndefined();
    expect(column(c, "contact")).toMatchObject({ format: "email", sensitive: true });
    expect(Object.keys(c.columns)).toEqual(readFileSync(join(repo, "contracts", "samples", "dealer-sales-w47.csv"), "utf8").split("\n")[0]?.split(","));
  });

  it("the same file gives the same bytes", async () => {
    const a = await runCli(["infer", "w47.csv"], { "w47.csv": sample });
    const b = await runCli(["infer", "w47.csv"], { "w47.csv": sample });
    expect(a.code).toBe(0);
    expect(b.stdout).toBe(a.stdout);
  });

  it("no value of the sensitive contact column reaches the draft", async () => {
    const r = await runCli(["infer", "w47.csv"], { "w47.csv": sample });
    expect(r.stdout).not.toMatch(/example\.(org|com)/);
  });
});

describe("csv-spectrum", () => {
  const files = readdirSync(join(spectrum, "csvs")).filter((f) => f.endsWith(".csv") && f !== "location_coordinates.csv");

  it.each(files)("%s", async (file) => {
    const data = readFileSync(join(spectrum, "csvs", file));
    const expected = JSON.parse(readFileSync(join(spectrum, "json", file.replace(/\.csv$/, ".json")), "utf8")) as Record<string, string>[];
    const r = await roundTrip(data, file);
    await compiles(r.infer.stdout);
    expect(r.check.code, r.check.stdout).toBe(0);
    expect(Object.keys(r.contract.columns)).toEqual(Object.keys(expected[0] ?? {}));
    expect((JSON.parse(r.check.stdout) as DeliveryReport).input.rows).toBe(expected.length);
  });

  it("empty.csv: blank cells make b and c optional integers; a is the key", async () => {
    const r = await roundTrip(readFileSync(join(spectrum, "csvs", "empty.csv")), "empty.csv");
    expect(r.contract.columns).toEqual({ a: { type: "integer", required: true }, b: { type: "integer" }, c: { type: "integer" } });
    expect(r.contract.keys).toEqual(["a"]);
  });

  it("newlines.csv: a value spanning lines keeps its column text", async () => {
    const r = await roundTrip(readFileSync(join(spectrum, "csvs", "newlines.csv")), "newlines.csv");
    expect(column(r.contract, "a").type).toBe("text");
    expect(column(r.contract, "b").type).toBe("integer");
  });

  it("location_coordinates.csv: a quote inside an unquoted field stops infer with exit 2 at file:line", async () => {
    const r = await runCli(["infer", "loc.csv"], { "loc.csv": readFileSync(join(spectrum, "csvs", "location_coordinates.csv")) });
    expect(r.code).toBe(2);
    expect(r.stdout).toBe("");
    expect(r.stderr.trim().split("\n")).toHaveLength(1);
    expect(r.stderr).toContain("loc.csv:2");
  });
});
