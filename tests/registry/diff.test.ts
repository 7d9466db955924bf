import { execFileSync } from "node:child_process";
import { writeFile } from "node:fs/promises";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { diffTables, isEmptyDiff, loadRegistry, parseCsvTable, parseManifest, readAtRevision, revisionWithContent, tableAtRevision, type RefTable } from "../../src/registry/index.js";
import { COLORS_CSV, COLORS_YAML, tempRepo } from "./helpers.js";

function table(csv: string, yaml = COLORS_YAML): RefTable {
  const m = parseManifest(yaml, "registry.yaml");
  if (!m.ok || !m.value[0]) throw new Error("manifest");
  const t = parseCsvTable(m.value[0], new TextEncoder().encode(csv), { file: "colors.csv", manifestFile: "registry.yaml", builtIn: false });
  if (!t.ok) throw new Error(JSON.stringify(t.problems));
  return t.value;
}

describe("diffTables", () => {
  it("lists keys added, removed and changed with the columns that changed", () => {
    const before = table(COLORS_CSV);
    const after = table("code,name,rank\nRED,Red,1\nBLU,Navy,4\nPNK,Pink,5\n");
    const d = diffTables(before, after);
    expect(d.added).toEqual(["PNK"]);
    expect(d.removed).toEqual(["GRN"]);
    expect(d.changed).toEqual([{ key: "BLU", changes: [{ column: "name", before: "Blue", after: "Navy" }, { column: "rank", before: "3", after: "4" }] }]);
    expect(isEmptyDiff(d)).toBe(false);
    expect(isEmptyDiff(diffTables(before, table(COLORS_CSV)))).toBe(true);
  });

  it("a typed cell rewritten as the same value is no change; a text cell rewritten is", () => {
    // rank is an integer column: 01 and 1 are one value. name is text: case and spelling count.
    const d = diffTables(table(COLORS_CSV), table("code,name,rank\nRED,Red,01\nGRN,green,2\nBLU,Blue,3\n"));
    expect(d.changed).toEqual([{ key: "GRN", changes: [{ column: "name", before: "Green", after: "green" }] }]);
  });

  it("reports columns added and removed, comparing only shared ones", () => {
    const yamlB = "tables:\n  colors:\n    file: c.csv\n    key: code\n    version: 2\n";
    const d = diffTables(table(COLORS_CSV), table("code,name,hex\nRED,Red,#f00\nGRN,Green,#0f0\nBLU,Blue,#00f\n", yamlB));
    expect([d.columnsAdded, d.columnsRemoved, d.changed, d.versionBefore, d.versionAfter]).toEqual([["hex"], ["rank"], [], "1.0", "2"]);
  });
});

function git(root: string, ...args: string[]): string {
  return execFileSync("git", ["-c", "user.name=t", "-c", "user.email=t@example.org", "-c", "commit.gpgsign=false", ...args], { cwd: root, encoding: "utf8" });
}

describe("tables at a git revision", () => {
  async function repoWithHistory(): Promise<string> {
    const root = await tempRepo({ "reference/registry.yaml": COLORS_YAML, "reference/colors.csv": COLORS_CSV });
    git(root, "init", "-q");
    git(root, "add", ".");
    git(root, "commit", "-q", "-m", "first");
    await writeFile(join(root, "reference/colors.csv"), "code,name,rank\nRED,Crimson,1\nBLU,Blue,3\nYLW,Yellow,4\n");
    await writeFile(join(root, "reference/registry.yaml"), COLORS_YAML.replace('"1.0"', '"1.1"'));
    return root;
  }

  it("diffs the working copy against a committed revision", async () => {
    const root = await repoWithHistory();
    const before = await tableAtRevision(root, "HEAD", "colors");
    const reg = await loadRegistry(root);
    if (!before.ok || !reg.ok) throw new Error("load");
    const after = reg.value.table("colors");
    if (!after) throw new Error("no table");
    const d = diffTables(before.value, after);
    expect([d.added, d.removed, d.changed, d.versionBefore, d.versionAfter]).toEqual([["YLW"], ["GRN"], [{ key: "RED", changes: [{ column: "name", before: "Red", after: "Crimson" }] }], "1.0", "1.1"]);
    expect(before.value.file).toBe("HEAD:reference/colors.csv");
  });

  it("finds the commit whose content matches a locked hash", async () => {
    const root = await repoWithHistory();
    const head = git(root, "rev-parse", "HEAD").trim();
    const first = await tableAtRevision(root, "HEAD", "colors");
    if (!first.ok) throw new Error("load");
    expect(await revisionWithContent(root, "reference/colors.csv", first.value.sha256)).toEqual({ ok: true, value: head });
    expect(await revisionWithContent(root, "reference/colors.csv", "0".repeat(64))).toEqual({ ok: true, value: undefined });
  });

  it("refuses option-like revisions and paths outside the repository, and reports unknown ones", async () => {
    const root = await repoWithHistory();
    for (const rev of ["--output=/tmp/x", "-p", "a b", "HEAD:x"]) expect((await readAtRevision(root, rev, "reference/colors.csv")).ok).toBe(false);
    for (const path of ["../etc/passwd", "/etc/passwd", "reference/../../x"]) expect((await readAtRevision(root, "HEAD", path)).ok).toBe(false);
    expect((await readAtRevision(root, "no-such-branch", "reference/colors.csv")).ok).toBe(false);
    expect((await tableAtRevision(root, "HEAD", "no-such-table")).ok).toBe(false);
    const ok = await readAtRevision(root, "HEAD", "reference/colors.csv");
    expect(ok.ok && ok.value.toString("utf8")).toBe(COLORS_CSV);
  });
});
