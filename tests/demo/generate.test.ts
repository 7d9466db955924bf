import { createHash } from "node:crypto";
import { mkdir, mkdtemp, readFile, rm } from "node:fs/promises";
import { join } from "node:path";
import { parse } from "csv-parse/sync";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { deliveryChunks, generateDelivery, HEADER, PROBLEM_KINDS, type ProblemKind } from "../../src/bench/generate.js";
import { mulberry32 } from "../../src/bench/prng.js";
import { run } from "../../src/cli/run.js";

function counts(): Record<ProblemKind, number> {
  return Object.fromEntries(PROBLEM_KINDS.map((k) => [k, 0])) as Record<ProblemKind, number>;
}

function digest(options: Parameters<typeof deliveryChunks>[0]): string {
  const h = createHash("sha256");
  for (const chunk of deliveryChunks(options, counts())) h.update(chunk);
  return h.digest("hex");
}

async function check(file: string): Promise<{ code: number; report: { checks: { rule: string; failed: number }[] } }> {
  let stdout = "";
  const code = await run(["check", file, "--contract", "contracts/dealer-sales.contract.yaml", "--report", "json=-"], {
    stdout: (t) => (stdout += t),
    stderr: () => undefined,
    env: {},
    cwd: process.cwd(),
  });
  return { code, report: JSON.parse(stdout) as { checks: { rule: string; failed: number }[] } };
}

let dir = "";
beforeAll(async () => {
  // Inside the repository's git-ignored .bench/: tablegate reads deliveries relative to the repository root.
  await mkdir(join(process.cwd(), ".bench"), { recursive: true });
  dir = await mkdtemp(join(process.cwd(), ".bench", "gen-test-"));
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

describe("mulberry32", () => {
  it("repeats its sequence for a seed and stays in [0, 1)", () => {
    const a = mulberry32(7);
    const b = mulberry32(7);
    const c = mulberry32(8);
    const xs = Array.from({ length: 1000 }, () => a());
    expect(Array.from({ length: 1000 }, () => b())).toEqual(xs);
    expect(Array.from({ length: 1000 }, () => c())).not.toEqual(xs);
    expect(xs.every((x) => x >= 0 && x < 1)).toBe(true);
    // A uniform generator's mean over 1000 draws lies near 0.5 (standard error about 0.009).
    expect(Math.abs(xs.reduce((s, x) => s + x, 0) / xs.length - 0.5)).toBeLessThan(0.05);
  });
});

describe("generateDelivery", () => {
  it("is deterministic per seed", () => {
    expect(digest({ rows: 5000, seed: 1 })).toBe(digest({ rows: 5000, seed: 1 }));
    expect(digest({ rows: 5000, seed: 1 })).not.toBe(digest({ rows: 5000, seed: 2 }));
  });

  it("writes a header and exactly the rows asked for, 16 fields each (read back with csv-parse)", async () => {
    const result = await generateDelivery({ rows: 3000, path: join(dir, "shape.csv") });
    const bytes = await readFile(result.path);
    expect(result.bytes).toBe(bytes.length);
    const records = parse(bytes) as string[][];
    expect(records[0]?.join(",")).toBe(HEADER);
    expect(records).toHaveLength(3001);
    expect(records.every((r) => r.length === 16)).toBe(true);
  });

  it("without planted problems, the delivery meets the demo contract", async () => {
    const result = await generateDelivery({ rows: 10_000, problemShare: 0, path: join(dir, "clean.csv") });
    expect(Object.values(result.planted).every((n) => n === 0)).toBe(true);
    const { code, report } = await check(result.path);
    expect(report.checks.filter((c) => c.failed > 0)).toEqual([]);
    expect(code).toBe(0);
  }, 60_000);

  it("each planted problem is one failure of its check", async () => {
    const result = await generateDelivery({ rows: 20_000, problemShare: 0.01, path: join(dir, "planted.csv") });
    const { code, report } = await check(result.path);
    expect(code).toBe(1);
    const failed = new Map(report.checks.map((c) => [c.rule, c.failed]));
    for (const kind of PROBLEM_KINDS) {
      expect(result.planted[kind], kind).toBeGreaterThan(0);
      if (kind === "rule:region-matches-state") continue;
      expect(failed.get(kind) ?? 0, kind).toBe(result.planted[kind]);
    }
    // "NORTH EAST" on a US row also contradicts the state's region.
    expect(failed.get("rule:region-matches-state") ?? 0).toBeGreaterThanOrEqual(result.planted["rule:region-matches-state"]);
    // A repeated line breaks its key and its invoice's line numbering.
    expect(failed.get("key:invoice_no+line_no")).toBe(result.planted.duplicates);
    const groups = failed.get("group:invoice-lines") ?? 0;
    expect(groups).toBeGreaterThan(0);
    expect(groups).toBeLessThanOrEqual(result.planted.duplicates);
  }, 60_000);
});
