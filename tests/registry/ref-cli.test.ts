import { execFileSync } from "node:child_process";
import { readFile, writeFile } from "node:fs/promises";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { runRef } from "../../src/cli/ref.js";
import { COLORS_CSV, COLORS_YAML, tempRepo } from "./helpers.js";

async function ref(cwd: string, ...args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = "";
  let err = "";
  const code = await runRef(args, { stdout: (s) => (out += s), stderr: (s) => (err += s), cwd });
  return { code, out, err };
}

function git(root: string, ...args: string[]): string {
  return execFileSync("git", ["-c", "user.name=t", "-c", "user.email=t@example.org", "-c", "commit.gpgsign=false", ...args], { cwd: root, encoding: "utf8" });
}

async function lockedRepo(): Promise<string> {
  const root = await tempRepo({ "reference/registry.yaml": COLORS_YAML, "reference/colors.csv": COLORS_CSV });
  git(root, "init", "-q");
  expect((await ref(root, "lock")).code).toBe(0);
  git(root, "add", ".");
  git(root, "commit", "-q", "-m", "colors");
  return root;
}

describe("tablegate ref", () => {
  it("lock writes the lock, lint passes, then a changed table fails lint with exit 1", async () => {
    const root = await lockedRepo();
    expect(JSON.parse(await readFile(join(root, "reference/registry.lock.json"), "utf8")).tables.colors.rows).toBe(3);
    expect((await ref(root, "lint")).code).toBe(0);
    await writeFile(join(root, "reference/colors.csv"), COLORS_CSV + "PNK,Pink,4\n");
    const r = await ref(root, "lint");
    expect(r.code).toBe(1);
    expect(r.err.trim().split("\n")).toHaveLength(1);
    expect(r.err).toContain("reference/registry.lock.json");
  });

  it("lint exits 1 on a broken table", async () => {
    const root = await tempRepo({ "reference/registry.yaml": COLORS_YAML, "reference/colors.csv": "code,name,rank\nRED,Red,1\nRED,Red,2\n" });
    const r = await ref(root, "lint");
    expect(r.code).toBe(1);
    expect(r.err).toContain("reference/colors.csv:3");
  });

  it("list shows every table with its lock state, as JSON too", async () => {
    const root = await lockedRepo();
    const r = await ref(root, "list", "--json");
    expect(r.code).toBe(0);
    const rows = JSON.parse(r.out) as { table: string; lock: string; rows: number }[];
    expect(rows.map((x) => [x.table, x.lock])).toEqual([["iso-3166-1", "built-in"], ["us-states", "built-in"], ["ca-provinces", "built-in"], ["colors", "locked"]]);
    expect((await ref(root, "list")).out.split("\n")[0]?.split(/\s+/)).toEqual(["table", "version", "rows", "key", "lock", "origin"]);
  });

  it("show pages through rows", async () => {
    const root = await lockedRepo();
    const r = await ref(root, "show", "us-states", "--page", "2", "--page-size", "10");
    expect(r.code).toBe(0);
    const dataLines = r.out.split("\n").filter((l) => /^[A-Z]{2}\s/.test(l));
    // rows 11-20 in file order (the shipped CSV is sorted by code)
    expect(dataLines).toHaveLength(10);
    expect(dataLines[0]?.slice(0, 2)).toBe("GA");
    expect((await ref(root, "show", "nope")).code).toBe(2);
    expect((await ref(root, "show", "colors", "--page", "0")).code).toBe(2);
    // us-states has 51 rows: six pages of 10, so there is no seventh.
    expect((await ref(root, "show", "us-states", "--page", "6", "--page-size", "10")).code).toBe(0);
    expect((await ref(root, "show", "us-states", "--page", "7", "--page-size", "10")).code).toBe(2);
  });

  it("show keeps one line per row when a cell holds a line break", async () => {
    const root = await tempRepo({ "reference/registry.yaml": COLORS_YAML, "reference/colors.csv": 'code,name,rank\nRED,"Red\nish",1\nGRN,Green,2\n' });
    const r = await ref(root, "show", "colors");
    expect(r.code).toBe(0);
    expect(r.out.split("\n").filter((l) => /^(RED|GRN)\s/.test(l))).toHaveLength(2);
    expect(r.out).toContain("Red\\nish");
  });

  it("diff against the lock finds the locked content in git history", async () => {
    const root = await lockedRepo();
    expect((await ref(root, "diff", "colors")).out).toContain("same content as the lock");
    await writeFile(join(root, "reference/colors.csv"), "code,name,rank\nRED,Red,1\nGRN,Lime,2\nPNK,Pink,4\n");
    const r = await ref(root, "diff", "colors", "--json");
    expect(r.code).toBe(0);
    const d = JSON.parse(r.out) as { added: string[]; removed: string[]; changed: { key: string; changes: { column: string }[] }[]; from: string };
    expect([d.added, d.removed, d.changed.map((c) => [c.key, c.changes.map((x) => x.column)])]).toEqual([["PNK"], ["BLU"], [["GRN", ["name"]]]]);
    expect(d.from).toBe(git(root, "rev-parse", "HEAD").trim());
  });

  it("diff --from reads a named revision; built-in and unknown tables are refused", async () => {
    const root = await lockedRepo();
    await writeFile(join(root, "reference/colors.csv"), COLORS_CSV.replace("BLU,Blue,3\n", ""));
    git(root, "commit", "-q", "-am", "drop blue");
    const r = await ref(root, "diff", "colors", "--from", "HEAD~1");
    expect(r.code).toBe(0);
    expect(r.out.split("\n")).toContain("- BLU");
    expect((await ref(root, "diff", "us-states")).code).toBe(2);
    expect((await ref(root, "diff", "colors", "--from", "--evil")).code).toBe(2);
    expect((await ref(root, "frobnicate")).code).toBe(2);
  });

  it("diff --from a revision before the table existed lists every row as added; a revision that is none is refused", async () => {
    const root = await lockedRepo();
    git(root, "commit", "-q", "--allow-empty", "-m", "later");
    const home = git(root, "rev-parse", "--abbrev-ref", "HEAD").trim();
    // The table exists at HEAD; build a branch where it never did.
    git(root, "checkout", "-q", "--orphan", "empty");
    git(root, "rm", "-rq", "--cached", ".");
    git(root, "commit", "-q", "--allow-empty", "-m", "nothing yet");
    const empty = git(root, "rev-parse", "HEAD").trim();
    git(root, "checkout", "-q", "-f", home);
    const r = await ref(root, "diff", "colors", "--from", empty, "--json");
    expect(r.code).toBe(0);
    expect((JSON.parse(r.out) as { added: string[] }).added).toEqual(["RED", "GRN", "BLU"]);
    expect((await ref(root, "diff", "colors", "--from", "no-such-rev")).code).toBe(2);
  });
});
