import { execFileSync } from "node:child_process";
import { readFile, writeFile } from "node:fs/promises";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { compareLock, LOCK_FILE, loadRegistry, readLock, renderLock, verifyLock, writeLock, type Registry } from "../../src/registry/index.js";
import { COLORS_CSV, COLORS_YAML, tempRepo } from "./helpers.js";

async function load(root: string): Promise<Registry> {
  const r = await loadRegistry(root);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.value;
}

async function colorsRepo(): Promise<string> {
  return tempRepo({ "reference/registry.yaml": COLORS_YAML, "reference/colors.csv": COLORS_CSV });
}

describe("lock", () => {
  it("this repository's lock matches its registry", async () => {
    const root = join(import.meta.dirname, "../..");
    expect(await verifyLock(root, await load(root))).toEqual({ ok: true, value: undefined });
  });

  it("pins version, row count and the SHA-256 of the CSV bytes; built-ins are left out", async () => {
    const root = await colorsRepo();
    const written = await writeLock(root, await load(root));
    expect(written.ok && written.value.changed).toBe(true);
    const lock = await readLock(root);
    expect(lock.ok && lock.value?.tables).toEqual({
      colors: {
        version: "1.0",
        rows: 3,
        // Outside check: the hash as coreutils sha256sum computes it.
        sha256: execFileSync("sha256sum", [join(root, "reference/colors.csv")], { encoding: "utf8" }).split(" ")[0],
        file: "reference/colors.csv",
      },
    });
    // rewriting an unchanged registry leaves the file alone
    const again = await writeLock(root, await load(root));
    expect(again.ok && again.value.changed).toBe(false);
  });

  it("refuses a table whose content no longer matches, one problem naming it", async () => {
    const root = await colorsRepo();
    await writeLock(root, await load(root));
    await writeFile(join(root, "reference/colors.csv"), COLORS_CSV.replace("Green", "Grün"));
    const reg = await load(root);
    const r = await verifyLock(root, reg);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.problems).toHaveLength(1);
      expect(r.problems[0]?.file).toBe(LOCK_FILE);
      expect(r.problems[0]?.message).toContain('"colors"');
    }
    const lockNow = await readLock(root);
    expect(compareLock(lockNow.ok ? lockNow.value : undefined, reg).map((i) => [i.table, i.kind])).toEqual([["colors", "changed"]]);
    // after `ref lock` it passes again
    await writeLock(root, reg);
    expect((await verifyLock(root, await load(root))).ok).toBe(true);
  });

  it("refuses a tampered lock entry", async () => {
    const root = await colorsRepo();
    await writeLock(root, await load(root));
    const path = join(root, LOCK_FILE);
    const text = await readFile(path, "utf8");
    await writeFile(path, text.replace(/"sha256": "[0-9a-f]{64}"/, `"sha256": "${"0".repeat(64)}"`));
    expect((await verifyLock(root, await load(root))).ok).toBe(false);
    await writeFile(path, text.replace('"rows": 3', '"rows": 4'));
    expect((await verifyLock(root, await load(root))).ok).toBe(false);
    await writeFile(path, text.replace('"version": "1.0"', '"version": "1.1"'));
    expect((await verifyLock(root, await load(root))).ok).toBe(false);
    await writeFile(path, "{ not json");
    const bad = await verifyLock(root, await load(root));
    expect(bad.ok ? [] : bad.problems.map((p) => p.file)).toEqual([LOCK_FILE]);
  });

  it("only checks the tables in use, and needs no lock for built-ins", async () => {
    const root = await colorsRepo();
    const reg = await load(root);
    // no lock file at all
    expect((await verifyLock(root, reg, ["iso-3166-1", "us-states"])).ok).toBe(true);
    expect((await verifyLock(root, reg, ["colors"])).ok).toBe(false);
    expect(compareLock(undefined, reg).map((i) => [i.table, i.kind])).toEqual([["colors", "no-lock"]]);
  });

  it("reports unlocked and stale entries in a full comparison; stale ones do not block a run", async () => {
    const root = await colorsRepo();
    const reg = await load(root);
    const lock = { tables: { gone: { version: "1", rows: 1, sha256: "a".repeat(64), file: "reference/gone.csv" } } };
    expect(compareLock(lock, reg).map((i) => [i.table, i.kind])).toEqual([["colors", "unlocked"], ["gone", "stale"]]);
    await writeFile(join(root, LOCK_FILE), renderLock({ tables: { ...lock.tables, colors: { version: "1.0", rows: 3, sha256: reg.table("colors")?.sha256 ?? "", file: "reference/colors.csv" } } }));
    expect((await verifyLock(root, reg)).ok).toBe(true);
  });

  it("renders with sorted names and a final newline", () => {
    const e = { version: "1", rows: 1, sha256: "b".repeat(64), file: "f.csv" };
    const text = renderLock({ tables: { zeta: e, alpha: e } });
    expect(text.endsWith("}\n")).toBe(true);
    expect(Object.keys((JSON.parse(text) as { tables: object }).tables)).toEqual(["alpha", "zeta"]);
  });
});
