import { symlink } from "node:fs/promises";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { loadRegistry, type Registry } from "../../src/registry/index.js";
import type { Problem, Result } from "../../src/problem.js";
import { COLORS_CSV, COLORS_YAML, tempRepo } from "./helpers.js";

function problems(r: Result<Registry>): readonly Problem[] {
  expect(r.ok).toBe(false);
  return r.ok ? [] : r.problems;
}

/** The problems of tables that did not load: the registry itself loads, and keeps them aside. */
function tableProblems(r: Result<Registry>): readonly Problem[] {
  expect(r.ok).toBe(true);
  return r.ok ? [...(r.value.broken?.().values() ?? [])].flat() : [];
}

function value(r: Result<Registry>): Registry {
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.value;
}

describe("loadRegistry", () => {
  it("loads this repository's demo registry next to the built-ins", async () => {
    const reg = value(await loadRegistry(join(import.meta.dirname, "../..")));
    expect(reg.tables().map((t) => t.name)).toEqual(["iso-3166-1", "us-states", "ca-provinces", "product-categories", "ship-methods", "sales-regions"]);
    const cats = reg.table("product-categories");
    expect(cats?.file).toBe("reference/product-categories.csv");
    expect(cats?.values("department")?.has("camp")).toBe(true);
    expect(cats?.types).toEqual(["text", "text", "text", "boolean", "date"]);
    const ship = reg.table("ship-methods");
    // blank cells read as NULL
    expect(ship?.get("PICK", 3)).toBeNull();
    expect(ship?.get("LTL", 3)).toBe("1500");
  });

  it("builds lookups: get by key and column index, null for a missing key, sets per column", async () => {
    const root = await tempRepo({ "reference/registry.yaml": COLORS_YAML, "reference/colors.csv": COLORS_CSV });
    const t = value(await loadRegistry(root)).table("colors");
    expect(t?.rows).toBe(3);
    expect(t?.columns).toEqual(["code", "name", "rank"]);
    expect(t?.get("GRN", 1)).toBe("Green");
    expect(t?.get("PNK", 1)).toBeNull();
    expect(t?.get("GRN", 9)).toBeNull();
    expect([...(t?.values("name") ?? [])]).toEqual(["Red", "Green", "Blue"]);
    expect(t?.values("nope")).toBeUndefined();
    // same set object on every call: built once
    expect(t?.values("name")).toBe(t?.values("name"));
    expect(t?.keys()).toEqual(["RED", "GRN", "BLU"]);
  });

  it("works without a registry.yaml (built-ins only)", async () => {
    const root = await tempRepo({ "README.md": "x" });
    expect(value(await loadRegistry(root)).tables().map((t) => t.name)).toEqual(["iso-3166-1", "us-states", "ca-provinces"]);
  });

  it("keeps a numeric version as written", async () => {
    const root = await tempRepo({ "reference/registry.yaml": COLORS_YAML.replace('"1.0"', "2026.10"), "reference/colors.csv": COLORS_CSV });
    expect(value(await loadRegistry(root)).table("colors")?.version).toBe("2026.10");
  });

  it("reports manifest schema errors at file:line:col", async () => {
    const yaml = ["tables:", "  colors:", "    file: colors.csv", "    key: code", '    version: "1"', "    colour: red", "  Bad_Name:", "    file: ../x.csv", "    key: k", "    version: 1", "  nokey:", "    file: n.csv", "    version: 1", ""].join("\n");
    const root = await tempRepo({ "reference/registry.yaml": yaml, "reference/colors.csv": COLORS_CSV });
    const ps = problems(await loadRegistry(root));
    const at = ps.map((p) => `${p.file}:${p.line}:${p.column}`).sort();
    expect(at).toEqual([
      "reference/registry.yaml:11:3", // nokey: missing key (on the table's name)
      "reference/registry.yaml:6:5", // colour: unknown key
      "reference/registry.yaml:7:3", // Bad_Name: table name pattern
      "reference/registry.yaml:8:11", // ../x.csv: file pattern
    ]);
  });

  it("reports YAML syntax errors with a position", async () => {
    const root = await tempRepo({ "reference/registry.yaml": "tables:\n  a: [1, 2\n" });
    const ps = problems(await loadRegistry(root));
    expect(ps[0]?.file).toBe("reference/registry.yaml");
    expect(ps[0]?.line).toBeGreaterThan(0);
  });

  it("checks each table: duplicate and blank keys, stray spaces, types, widths", async () => {
    const csv = "code,name,rank\nRED,Red,1\nGRN, Green,2\nRED,Rouge,3\n,Blank,4\nBLU,Blue,three\nYLW,Yellow\n";
    const root = await tempRepo({ "reference/registry.yaml": COLORS_YAML, "reference/colors.csv": csv });
    const ps = tableProblems(await loadRegistry(root));
    expect(ps.every((p) => p.file === "reference/colors.csv")).toBe(true);
    // line 3 spaces, 4 duplicate key, 5 blank key, 6 not an integer, 7 wrong width
    expect(ps.map((p) => p.line)).toEqual([3, 4, 5, 6, 7]);
  });

  it("counts physical lines across quoted line breaks and blank lines", async () => {
    const csv = 'code,name,rank\nRED,"Red\nish",1\n\nRED,Red,2\n';
    const root = await tempRepo({ "reference/registry.yaml": COLORS_YAML, "reference/colors.csv": csv });
    expect(tableProblems(await loadRegistry(root)).map((p) => p.line)).toEqual([5]);
  });

  it("names the line where an unreadable record starts, and the line of a byte that is not UTF-8", async () => {
    const quote = await tempRepo({ "reference/registry.yaml": COLORS_YAML, "reference/colors.csv": 'code,name,rank\nRED,"Red,1\nGRN,Green,2\nBLU,Blue,3\n' });
    expect(tableProblems(await loadRegistry(quote)).map((p) => p.line)).toEqual([2]);
    const bytes = Buffer.concat([Buffer.from("code,name,rank\nRED,Red,1\nGRN,Gr"), Buffer.from([0xe9]), Buffer.from("en,2\n")]);
    const latin = await tempRepo({ "reference/registry.yaml": COLORS_YAML, "reference/colors.csv": bytes });
    expect(tableProblems(await loadRegistry(latin)).map((p) => p.line)).toEqual([3]);
  });

  it("reads numbers as a delivery's integer column does: a leading sign is fine, a decimal point is not", async () => {
    const ok = await tempRepo({ "reference/registry.yaml": COLORS_YAML, "reference/colors.csv": "code,name,rank\nRED,Red,+1\nGRN,Green,-2\n" });
    expect(tableProblems(await loadRegistry(ok))).toEqual([]);
    const bad = await tempRepo({ "reference/registry.yaml": COLORS_YAML, "reference/colors.csv": "code,name,rank\nRED,Red,1.0\n" });
    expect(tableProblems(await loadRegistry(bad)).map((p) => p.line)).toEqual([2]);
  });

  it("requires declared columns to match the header", async () => {
    const root = await tempRepo({ "reference/registry.yaml": COLORS_YAML, "reference/colors.csv": "code,label,rank\nRED,Red,1\n" });
    const ps = tableProblems(await loadRegistry(root));
    // declared `name` missing: at the manifest's columns map; undeclared `label`: at the CSV header
    expect(ps.map((p) => `${p.file}:${p.line}`).sort()).toEqual(["reference/colors.csv:1", "reference/registry.yaml:8"]);
  });

  it("reports a key column absent from the CSV at the manifest's key", async () => {
    const root = await tempRepo({ "reference/registry.yaml": COLORS_YAML.replace("key: code", "key: id").replace("      code: text\n", ""), "reference/colors.csv": "name,rank\nRed,1\n" });
    const ps = tableProblems(await loadRegistry(root));
    expect(ps.map((p) => `${p.file}:${p.line}:${p.column}`)).toEqual(["reference/registry.yaml:4:10"]);
  });

  it("reports a missing CSV at the manifest's file entry", async () => {
    const root = await tempRepo({ "reference/registry.yaml": COLORS_YAML });
    expect(tableProblems(await loadRegistry(root)).map((p) => `${p.file}:${p.line}:${p.column}`)).toEqual(["reference/registry.yaml:3:11"]);
  });

  it("refuses a CSV reached through a link that leaves the registry folder", async () => {
    const outside = await tempRepo({ "colors.csv": COLORS_CSV });
    const root = await tempRepo({ "reference/registry.yaml": COLORS_YAML });
    await symlink(join(outside, "colors.csv"), join(root, "reference/colors.csv"));
    const ps = tableProblems(await loadRegistry(root));
    expect(ps).toHaveLength(1);
    expect(ps[0]?.line).toBe(3);
  });

  it("treats a name that clashes with a built-in as a problem at the clashing name", async () => {
    const yaml = COLORS_YAML.replace("  colors:", "  us-states:");
    const root = await tempRepo({ "reference/registry.yaml": yaml, "reference/colors.csv": COLORS_CSV });
    expect(problems(await loadRegistry(root)).map((p) => `${p.file}:${p.line}:${p.column}`)).toEqual(["reference/registry.yaml:2:3"]);
  });
});

describe("further registry roots", () => {
  const SIZES_YAML = 'tables:\n  sizes:\n    file: sizes.csv\n    key: code\n    version: "3.1.0"\n';
  const SIZES_CSV = "code,label\nS,Small\nM,Medium\nL,Large\n";

  it("loads a folder root and an npm package's registry.yaml from node_modules", async () => {
    const root = await tempRepo({
      "reference/registry.yaml": COLORS_YAML,
      "reference/colors.csv": COLORS_CSV,
      "shared/registry.yaml": SIZES_YAML,
      "shared/sizes.csv": SIZES_CSV,
      "node_modules/@acme/codes/package.json": '{"name":"@acme/codes","version":"1.0.0"}',
      "node_modules/@acme/codes/registry.yaml": SIZES_YAML.replace(/sizes/g, "fits"),
      "node_modules/@acme/codes/fits.csv": SIZES_CSV,
      "node_modules/plain-codes/package.json": '{"name":"plain-codes","version":"1.0.0"}',
      "node_modules/plain-codes/reference/registry.yaml": SIZES_YAML.replace(/sizes/g, "widths"),
      "node_modules/plain-codes/reference/widths.csv": SIZES_CSV,
    });
    const reg = value(await loadRegistry(root, ["./shared", "@acme/codes", "plain-codes"]));
    expect(reg.tables().map((t) => `${t.name}@${t.file}`).slice(3)).toEqual([
      "colors@reference/colors.csv",
      "sizes@shared/sizes.csv",
      "fits@node_modules/@acme/codes/fits.csv",
      "widths@node_modules/plain-codes/reference/widths.csv",
    ]);
    expect(reg.table("fits")?.origin).toBe("node_modules/@acme/codes/registry.yaml");
    expect(reg.table("fits")?.get("M", 1)).toBe("Medium");
  });

  it("reports a clash between two roots at the second definition", async () => {
    const root = await tempRepo({
      "reference/registry.yaml": SIZES_YAML,
      "reference/sizes.csv": SIZES_CSV,
      "node_modules/team-codes/package.json": "{}",
      "node_modules/team-codes/registry.yaml": SIZES_YAML,
      "node_modules/team-codes/sizes.csv": SIZES_CSV,
    });
    const ps = problems(await loadRegistry(root, ["team-codes"]));
    expect(ps.map((p) => `${p.file}:${p.line}:${p.column}`)).toEqual(["node_modules/team-codes/registry.yaml:2:3"]);
  });

  it("reports roots that are missing, not installed, outside the repository or not names", async () => {
    const root = await tempRepo({ "node_modules/bare/package.json": "{}" });
    const at = { file: "tablegate.yaml", line: 4, column: 5, message: "" };
    const ps = problems(await loadRegistry(root, [{ spec: "./nope", at }, "not-installed", "bare", "../outside", "Bad Name!"]));
    expect(ps).toHaveLength(5);
    expect(ps[0]).toMatchObject({ file: "tablegate.yaml", line: 4, column: 5 });
  });
});
