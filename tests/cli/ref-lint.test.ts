import { writeFile } from "node:fs/promises";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { run } from "../../src/cli/run.js";
import { COLORS_CSV, COLORS_YAML, tempRepo } from "../registry/helpers.js";

async function tg(cwd: string, ...argv: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = "";
  let err = "";
  const code = await run(argv, { stdout: (s) => (out += s), stderr: (s) => (err += s), env: {}, cwd });
  return { code, out, err };
}

interface LintJson {
  ok: boolean;
  tables: number;
  problems: { file: string; line?: number; column?: number; table?: string; kind?: string }[];
}

describe("tablegate ref lint --json", () => {
  it("passes with a matching lock, then names each table that left the lock with its kind", async () => {
    const root = await tempRepo({ ".git/HEAD": "", "reference/registry.yaml": COLORS_YAML, "reference/colors.csv": COLORS_CSV });
    const unlocked = await tg(root, "ref", "lint", "--json");
    expect(unlocked.code).toBe(1);
    expect((JSON.parse(unlocked.out) as LintJson).problems.map((p) => [p.table, p.kind])).toEqual([["colors", "no-lock"]]);
    expect((await tg(root, "ref", "lock")).code).toBe(0);
    const clean = await tg(root, "ref", "lint", "--json");
    expect(clean.code).toBe(0);
    expect(JSON.parse(clean.out)).toEqual({ ok: true, tables: 4, problems: [] });
    await writeFile(join(root, "reference/colors.csv"), COLORS_CSV + "PNK,Pink,4\n");
    const changed = JSON.parse((await tg(root, "ref", "lint", "--json")).out) as LintJson;
    expect([changed.ok, changed.problems.map((p) => [p.file, p.table, p.kind])]).toEqual([false, [["reference/registry.lock.json", "colors", "changed"]]]);
  });

  it("gives a broken table's problems with file, line and column", async () => {
    const root = await tempRepo({ ".git/HEAD": "", "reference/registry.yaml": COLORS_YAML, "reference/colors.csv": "code,name,rank\nRED,Red,1\nRED,Red,x\n" });
    const r = await tg(root, "ref", "lint", "--json");
    expect(r.code).toBe(1);
    const j = JSON.parse(r.out) as LintJson;
    expect(j.ok).toBe(false);
    expect(j.problems.map((p) => `${p.file}:${p.line}`).sort()).toEqual(["reference/colors.csv:3", "reference/colors.csv:3"]);
  });

  it("the CLI reads further registries from tablegate.yaml", async () => {
    const root = await tempRepo({
      ".git/HEAD": "",
      "tablegate.yaml": "tablegate: 1\nregistries:\n  - ./shared/codes\n",
      "shared/codes/registry.yaml": COLORS_YAML,
      "shared/codes/colors.csv": COLORS_CSV,
    });
    const r = await tg(root, "ref", "list", "--json");
    expect(r.code).toBe(0);
    expect((JSON.parse(r.out) as { table: string; origin: string }[]).find((t) => t.table === "colors")?.origin).toBe("shared/codes/registry.yaml");
    const bad = await tempRepo({ ".git/HEAD": "", "tablegate.yaml": "tablegate: 1\nregistries:\n  - ./missing\n" });
    const missing = await tg(bad, "ref", "list");
    expect(missing.code).toBe(2);
    expect(missing.err).toContain("tablegate.yaml:3");
  });
});

describe("tablegate ref lint --report", () => {
  it("writes registry problems in check's report formats: JSON valid per the report schema, rule registry.table on the CSV line", async () => {
    const root = await tempRepo({ ".git/HEAD": "", "reference/registry.yaml": COLORS_YAML, "reference/colors.csv": "code,name,rank\nRED,Red,1\nRED,Red,2\n" });
    const r = await tg(root, "ref", "lint", "--report", "json=-", "--report", "junit=lint.xml");
    expect(r.code).toBe(1);
    const report = JSON.parse(r.out) as { verdict: string; input: { path: string }; findings: { rule: string; line?: number }[] };
    expect(report.verdict).toBe("fail");
    expect(report.input.path).toBe("reference/colors.csv");
    expect(report.findings.map((f) => [f.rule, f.line])).toEqual([["registry.table", 3]]);
    const { Ajv2020 } = await import("ajv/dist/2020.js");
    const { readSchema } = await import("../../src/schema/locate.js");
    const validate = new Ajv2020({ strict: false, allErrors: true }).compile(readSchema("report.schema.json"));
    expect(validate(report)).toBe(true);
  });
});
