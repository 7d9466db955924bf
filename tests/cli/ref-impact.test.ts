import { execFileSync } from "node:child_process";
import { mkdir, writeFile } from "node:fs/promises";
import { dirname, join } from "node:path";
import { describe, expect, it } from "vitest";
import { run } from "../../src/cli/run.js";
import { tempDir } from "../helpers/temp-dir.js";

interface Ran {
  readonly code: number;
  readonly out: string;
  readonly err: string;
}

async function tg(cwd: string, ...argv: string[]): Promise<Ran> {
  let out = "";
  let err = "";
  const code = await run(argv, { stdout: (s) => (out += s), stderr: (s) => (err += s), env: {}, cwd });
  return { code, out, err };
}

function git(root: string, ...args: string[]): string {
  return execFileSync("git", ["-c", "user.name=t", "-c", "user.email=t@example.org", "-c", "commit.gpgsign=false", ...args], { cwd: root, encoding: "utf8" });
}

async function put(root: string, files: Record<string, string>): Promise<void> {
  for (const [path, text] of Object.entries(files)) {
    await mkdir(dirname(join(root, path)), { recursive: true });
    await writeFile(join(root, path), text);
  }
}

// Invented data: an outdoor-gear wholesaler's product categories and dealer sales territories.
const REGISTRY = `tables:
  gear-categories:
    file: gear-categories.csv
    key: code
    version: "2026.1"
    source: merchandising team
  dealer-territories:
    file: dealer-territories.csv
    key: state
    version: "2026.1"
    source: sales operations
`;
const CATEGORIES = "code,name\nTENT,Tents\nPACK,Backpacks\nSTOVE,Camp stoves\n";
const TERRITORIES = "state,region\nWA,PACIFIC\nOR,PACIFIC\nCO,MOUNTAIN\nUT,MOUNTAIN\n";
const CONTRACT = `tablegate: 1
name: dealer-orders
columns:
  order_no: { type: text, required: true }
  category: { type: text, codes: { table: gear-categories, column: code } }
  state: { type: text }
  sales_region: { type: text }
rules:
  - id: region-matches-territory
    assert: sales_region = lookup('dealer-territories', state, 'region')
  - id: order-prefix
    assert: order_no LIKE 'A-%'
`;
// Row 5 (LAMP) fails category.codes under both versions; it must not show up as a change.
const W48 = "order_no,category,state,sales_region\nA-1,TENT,WA,PACIFIC\nA-2,PACK,CO,MOUNTAIN\nA-3,STOVE,UT,MOUNTAIN\nA-4,TENT,OR,PACIFIC\nA-5,LAMP,WA,PACIFIC\n";
const W47 = "order_no,category,state,sales_region\nA-1,TENT,WA,PACIFIC\nA-2,PACK,OR,PACIFIC\n";

async function project(): Promise<string> {
  const root = tempDir("tg-impact-");
  await put(root, {
    "tablegate.yaml": "tablegate: 1\ndeliveries:\n  - files: data/orders-*.csv\n    contract: contracts/dealer-orders.contract.yaml\n",
    "reference/registry.yaml": REGISTRY,
    "reference/gear-categories.csv": CATEGORIES,
    "reference/dealer-territories.csv": TERRITORIES,
    "contracts/dealer-orders.contract.yaml": CONTRACT,
    "data/orders-w48.csv": W48,
    "data/orders-w47.csv": W47,
    "data/returns-w48.csv": "x\n1\n",
  });
  git(root, "init", "-q");
  expect((await tg(root, "ref", "lock")).code).toBe(0);
  git(root, "add", ".");
  git(root, "commit", "-q", "-m", "start");
  return root;
}

interface Change {
  rule: string;
  level?: string;
  row?: number;
  line?: number;
  column?: string;
  value?: string;
}
interface ImpactJson {
  locked: { revision: string; same: boolean } | null;
  contracts: { path: string; checks: { via: string; rules: string[]; line: number }[]; compiles_now: boolean; compiles_locked: boolean | null }[];
  deliveries: { path: string; fails_now: Change[]; passes_now: Change[] }[];
  skipped: { path: string; reason: string }[];
  breaks: boolean;
}

const pick = (c: Change) => [c.rule, c.row, c.line, c.column, c.value];

describe("tablegate ref impact", () => {
  it("lists the contracts and checks that read a table, with the YAML line of each", async () => {
    const root = await project();
    const r = await tg(root, "ref", "impact", "dealer-territories", "--json");
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out) as ImpactJson;
    expect(j.contracts.map((c) => [c.path, c.checks.map((x) => [x.via, x.rules, x.line])])).toEqual([
      ["contracts/dealer-orders.contract.yaml", [["assert", ["rule:region-matches-territory"], 10]]],
    ]);
    const cats = JSON.parse((await tg(root, "ref", "impact", "gear-categories", "--json")).out) as ImpactJson;
    expect(cats.contracts[0]?.checks.map((x) => [x.via, x.rules, x.line])).toEqual([["codes", ["category.codes"], 5]]);
    expect(cats.locked?.same).toBe(true);
  });

  it("a removed code and a renamed region: exactly the rows that newly fail, and check refuses until ref lock", async () => {
    const root = await project();
    await writeFile(join(root, "reference/gear-categories.csv"), "code,name\nTENT,Tents\nPACK,Backpacks\n");
    await writeFile(join(root, "reference/dealer-territories.csv"), "state,region\nWA,PACIFIC\nOR,PACIFIC\nCO,ROCKIES\nUT,ROCKIES\n");

    const diff = JSON.parse((await tg(root, "ref", "diff", "dealer-territories", "--json")).out) as { changed: { key: string }[] };
    expect(diff.changed.map((c) => c.key)).toEqual(["CO", "UT"]);

    const cats = await tg(root, "ref", "impact", "gear-categories", "--data", "data/*.csv", "--json");
    expect(cats.code).toBe(1);
    const cj = JSON.parse(cats.out) as ImpactJson;
    expect(cj.locked?.revision).toBe(git(root, "rev-parse", "HEAD").trim());
    expect(cj.deliveries.map((d) => [d.path, d.fails_now.map(pick), d.passes_now.map(pick)])).toEqual([
      ["data/orders-w47.csv", [], []],
      ["data/orders-w48.csv", [["category.codes", 3, 4, "category", "STOVE"]], []],
    ]);
    expect(cj.skipped).toEqual([{ path: "data/returns-w48.csv", reason: "unclaimed" }]);

    const regions = await tg(root, "ref", "impact", "dealer-territories", "--data", "data/orders-*.csv", "--json");
    expect(regions.code).toBe(1);
    const rj = JSON.parse(regions.out) as ImpactJson;
    expect(rj.deliveries.find((d) => d.path === "data/orders-w48.csv")?.fails_now.map((c) => [c.rule, c.row, c.line])).toEqual([
      ["rule:region-matches-territory", 2, 3],
      ["rule:region-matches-territory", 3, 4],
    ]);
    expect(rj.deliveries.find((d) => d.path === "data/orders-w47.csv")?.fails_now).toEqual([]);

    const text = await tg(root, "ref", "impact", "dealer-territories", "--data", "data/orders-*.csv");
    expect(text.code).toBe(1);
    expect(text.out.split("\n").filter((l) => l.includes("rule:region-matches-territory") && /row \d/.test(l))).toHaveLength(2);

    const refused = await tg(root, "check");
    expect(refused.code).toBe(2);
    expect(refused.err).toContain('"gear-categories"');
    expect(refused.err).toContain('"dealer-territories"');
    expect((await tg(root, "ref", "lock")).code).toBe(0);
    const judged = await tg(root, "check", "data/orders-w48.csv");
    expect(judged.code).toBe(1);
  });

  it("a code added back makes a failing row pass: reported the other way, exit 0", async () => {
    const root = await project();
    await writeFile(join(root, "reference/gear-categories.csv"), CATEGORIES + "LAMP,Lamps\n");
    const r = await tg(root, "ref", "impact", "gear-categories", "--data", "data/orders-w48.csv", "--json");
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out) as ImpactJson;
    expect(j.deliveries.map((d) => [d.fails_now.map(pick), d.passes_now.map(pick)])).toEqual([[[], [["category.codes", 5, 6, "category", "LAMP"]]]]);
    expect(j.breaks).toBe(false);
  });

  it("sensitive cells stay masked; a new warning-level finding is listed but does not fail the run", async () => {
    const root = await project();
    await writeFile(
      join(root, "contracts/dealer-orders.contract.yaml"),
      CONTRACT.replace("category: { type: text, codes", "category: { type: text, sensitive: true, codes").replace("  - id: region-matches-territory\n", "  - id: region-matches-territory\n    level: warning\n"),
    );
    git(root, "commit", "-q", "-am", "sensitive category, region rule a warning");
    await writeFile(join(root, "reference/gear-categories.csv"), "code,name\nTENT,Tents\nPACK,Backpacks\n");
    const cats = await tg(root, "ref", "impact", "gear-categories", "--data", "./data/orders-w48.csv", "--json");
    expect(cats.code).toBe(1);
    expect(cats.out).not.toContain("STOVE");
    const change = (JSON.parse(cats.out) as ImpactJson).deliveries[0]?.fails_now[0];
    expect([change?.rule, change?.row, change?.value?.length]).toEqual(["category.codes", 3, 5]);
    expect((await tg(root, "ref", "impact", "gear-categories", "--data", "data/orders-w48.csv")).out).not.toContain("STOVE");

    await writeFile(join(root, "reference/gear-categories.csv"), CATEGORIES);
    await writeFile(join(root, "reference/dealer-territories.csv"), "state,region\nWA,PACIFIC\nOR,PACIFIC\nCO,ROCKIES\nUT,MOUNTAIN\n");
    const regions = await tg(root, "ref", "impact", "dealer-territories", "--data", "data/orders-w48.csv", "--json");
    expect(regions.code).toBe(0);
    const j = JSON.parse(regions.out) as ImpactJson;
    expect(j.deliveries[0]?.fails_now.map((c) => [c.level, c.row])).toEqual([["warning", 2]]);
  });

  it("a column the contract looks up removed from the table: the contract breaks", async () => {
    const root = await project();
    await writeFile(join(root, "reference/dealer-territories.csv"), "state,zone\nWA,PACIFIC\nOR,PACIFIC\nCO,MOUNTAIN\nUT,MOUNTAIN\n");
    const r = await tg(root, "ref", "impact", "dealer-territories", "--json");
    expect(r.code).toBe(1);
    const j = JSON.parse(r.out) as ImpactJson;
    expect(j.contracts.map((c) => [c.path, c.compiles_now, c.compiles_locked])).toEqual([["contracts/dealer-orders.contract.yaml", false, true]]);
  });

  it("--contract judges every --data file with one contract; --from compares with a named revision", async () => {
    const root = await project();
    const first = git(root, "rev-parse", "HEAD").trim();
    await writeFile(join(root, "reference/gear-categories.csv"), "code,name\nTENT,Tents\nSTOVE,Camp stoves\n");
    await tg(root, "ref", "lock");
    git(root, "commit", "-q", "-am", "drop PACK");
    const locked = JSON.parse((await tg(root, "ref", "impact", "gear-categories", "--data", "data/orders-w48.csv", "--json")).out) as ImpactJson;
    expect(locked.locked?.same).toBe(true);
    expect(locked.deliveries[0]?.fails_now).toEqual([]);
    const r = await tg(root, "ref", "impact", "gear-categories", "--data", "data/orders-w48.csv", "--contract", "contracts/dealer-orders.contract.yaml", "--from", first, "--json");
    expect(r.code).toBe(1);
    const j = JSON.parse(r.out) as ImpactJson;
    expect(j.deliveries[0]?.fails_now.map(pick)).toEqual([["category.codes", 2, 3, "category", "PACK"]]);
  });

  it("cannot run: unknown table, a table not in the lock, a built-in table with --data, bad arguments", async () => {
    const root = await project();
    expect((await tg(root, "ref", "impact", "no-such-table")).code).toBe(2);
    expect((await tg(root, "ref", "impact")).code).toBe(2);
    expect((await tg(root, "ref", "impact", "gear-categories", "--contract", "contracts/dealer-orders.contract.yaml")).code).toBe(2);
    expect((await tg(root, "ref", "impact", "us-states", "--data", "data/*.csv")).code).toBe(2);
    await put(root, { "reference/registry.yaml": REGISTRY + "  ship-methods:\n    file: ship-methods.csv\n    key: code\n    version: \"1\"\n", "reference/ship-methods.csv": "code\nGROUND\n" });
    const r = await tg(root, "ref", "impact", "ship-methods", "--data", "data/*.csv");
    expect(r.code).toBe(2);
    expect(r.err).toContain("ship-methods");
  });
});

describe("tablegate ref impact without tablegate.yaml", () => {
  it("checks --data files against the one contract that reads the table", async () => {
    const root = tempDir("tg-impact-solo-");
    const files: Record<string, string> = {
      "reference/registry.yaml": "tables:\n  gear-categories:\n    file: gear-categories.csv\n    key: code\n    version: \"1\"\n",
      "reference/gear-categories.csv": "code\nTENT\nSTOVE\n",
      "contracts/orders.contract.yaml": "tablegate: 1\nname: orders\ncolumns:\n  id: { type: integer }\n  category: { type: text, codes: { table: gear-categories, column: code } }\n",
      "data/w1.csv": "id,category\n1,TENT\n2,STOVE\n",
    };
    for (const [f, text] of Object.entries(files)) {
      await mkdir(join(root, dirname(f)), { recursive: true });
      await writeFile(join(root, f), text);
    }
    git(root, "init", "-q");
    git(root, "config", "user.email", "ci@example.org");
    git(root, "config", "user.name", "ci");
    expect((await tg(root, "ref", "lock")).code).toBe(0);
    git(root, "add", "-A");
    git(root, "commit", "-qm", "start");
    await writeFile(join(root, "reference/gear-categories.csv"), "code\nTENT\n");
    const r = await tg(root, "ref", "impact", "gear-categories", "--data", "data/*.csv", "--json");
    expect(r.code).toBe(1);
    const j = JSON.parse(r.out) as ImpactJson;
    expect(j.deliveries.map((d) => [d.path, d.fails_now.map((c) => [c.rule, c.row])])).toEqual([["data/w1.csv", [["category.codes", 2]]]]);
  });
});
