/**
 * The parse thread must change nothing but speed. The built tool (the thread needs compiled scripts;
 * `npm test` builds first) checks each delivery twice, `--parse-thread on` and `off`, and the two runs
 * must agree to the byte: exit status, JSON report, stderr. The deliveries are every golden case (all
 * encodings, gzip, TSV, NDJSON, structure breaks), the demo samples, and generated ones large enough to
 * cross many batches and the thread's flow control.
 */
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import { join, relative } from "node:path";
import { gzipSync } from "node:zlib";
import { describe, expect, it } from "vitest";
import { run as builtRun } from "../../dist/cli/run.js";
import { parseThreadAvailable } from "../../dist/input/parse-thread.js";
import { generateDelivery } from "../../src/bench/generate.js";
import { runCli } from "../helpers/cli.js";

const ROOT = process.cwd();
const GOLDEN = join(ROOT, "tests/golden");
const WORK = join(ROOT, "test-artifacts", "parse-thread");
mkdirSync(WORK, { recursive: true });

interface Outcome {
  readonly code: number;
  readonly stdout: string;
  readonly stderr: string;
}

/** The built command line, run from the repository root (where the demo contract's tables live). */
async function inRepo(argv: readonly string[]): Promise<Outcome> {
  let stdout = "";
  let stderr = "";
  const code = await builtRun(argv, {
    stdout: (s) => { stdout += s; },
    stderr: (s) => { stderr += s; },
    env: { NO_COLOR: "1" },
    cwd: ROOT,
    stderrIsTty: false,
    stdoutIsTty: false,
  });
  return { code, stdout, stderr };
}

/** Both ways, in the repository; the threaded run must equal the other. */
async function agreeInRepo(file: string, contract: string, extra: readonly string[] = []): Promise<Outcome> {
  const args = ["check", relative(ROOT, file), "--contract", contract, "--report", "json=-", ...extra];
  const on = await inRepo([...args, "--parse-thread", "on"]);
  const off = await inRepo([...args, "--parse-thread", "off"]);
  expect(on).toEqual(off);
  return off;
}

describe("the parse thread", () => {
  it("is available in the built package, so `on` really runs it", () => {
    expect(parseThreadAvailable()).toBe(true);
  });

  const cases = readdirSync(GOLDEN, { withFileTypes: true }).filter((d) => d.isDirectory()).map((d) => d.name).sort();
  it("gives the same exit status, report and messages on every golden case", async () => {
    expect(cases.length).toBeGreaterThanOrEqual(40);
    for (const name of cases) {
      const dir = join(GOLDEN, name);
      const data = readdirSync(dir).find((f) => f.startsWith("data.")) ?? "data.csv";
      const expected = JSON.parse(readFileSync(join(dir, "expected.json"), "utf8")) as { args?: string[] };
      const files = { "contract.yaml": readFileSync(join(dir, "contract.yaml")), [data]: readFileSync(join(dir, data)) };
      const args = ["check", data, "--contract", "contract.yaml", "--report", "json=-", ...(expected.args ?? [])];
      const on = await runCli([...args, "--parse-thread", "on"], files, { run: builtRun });
      const off = await runCli([...args, "--parse-thread", "off"], files, { run: builtRun });
      expect({ name, ...on }).toEqual({ name, ...off });
    }
  }, 120_000);

  it("gives the same report on the demo's samples", async () => {
    for (const week of ["w47", "w48"]) {
      await agreeInRepo(join(ROOT, `contracts/samples/dealer-sales-${week}.csv`), "contracts/dealer-sales.contract.yaml");
    }
  }, 60_000);

  it("gives the same report on a generated delivery of many batches, plain and gzipped, cut short or not", async () => {
    const gen = await generateDelivery({ rows: 40_000, problemShare: 0.01, path: join(WORK, "dealer-sales-40000.csv") });
    const contract = "contracts/dealer-sales.contract.yaml";
    const plain = await agreeInRepo(gen.path, contract);
    expect(plain.code).toBe(1);
    const report = JSON.parse(plain.stdout) as { input: { rows: number }; counts: { error: number } };
    expect(report.input.rows).toBe(40_000);
    expect(report.counts.error).toBeGreaterThan(100);
    // Kept findings are cut at --max-findings in file order; both runs must cut at the same one.
    await agreeInRepo(gen.path, contract, ["--max-findings", "7"]);

    const bytes = readFileSync(gen.path);
    const gz = join(WORK, "dealer-sales-40000.csv.gz");
    writeFileSync(gz, gzipSync(bytes));
    expect((await agreeInRepo(gz, contract)).stdout.replace(/"(path|sha256|bytes)": ?("[^"]*"|\d+)/g, "")).toBe(plain.stdout.replace(/"(path|sha256|bytes)": ?("[^"]*"|\d+)/g, ""));

    // A bad byte two thirds in: reading stops there, after many batches, the same way on both.
    const cut = Math.floor((bytes.length * 2) / 3);
    const broken = join(WORK, "dealer-sales-broken.csv");
    writeFileSync(broken, Buffer.concat([bytes.subarray(0, cut), Buffer.from([0xff]), bytes.subarray(cut)]));
    const stopped = JSON.parse((await agreeInRepo(broken, contract)).stdout) as { findings: { rule: string }[]; input: { rows: number } };
    expect(stopped.input.rows).toBeLessThan(40_000);
    expect(stopped.findings.some((f) => f.rule === "file.structure")).toBe(true);
  }, 120_000);

  it("gives the same report on long, quoted, multi-line and non-ASCII cells with CRLF line ends", async () => {
    const contract = [
      "tablegate: 1",
      "name: notes",
      "keys:",
      "  - [id]",
      "duplicates: error",
      "columns:",
      "  id: { type: integer, min: 1 }",
      "  note: { type: text, max_length: 60 }",
      "  place: { type: text, codes: [tent, hut, shelter] }",
      "groups:",
      "  - id: places",
      "    by: [place]",
      "    assert: count() <= 30000",
      "",
    ].join("\n");
    const lines = ["id,note,place"];
    for (let i = 1; i <= 30_000; i++) {
      const id = i % 997 === 0 ? i - 1 : i; // some repeated keys
      const note = i % 5 === 0 ? `"line one of ${i}\r\nline two, with ""quotes"""` : i % 7 === 0 ? `caf\u00e9 \u{1F3D5}\uFE0F n\u00b0${i} ${"x".repeat(i % 80)}` : `note ${i}`;
      const place = ["tent", "hut", "shelter", "cave"][i % 4];
      lines.push(`${id},${note},${place}`);
    }
    const file = join(WORK, "notes.csv");
    writeFileSync(file, `${lines.join("\r\n")}\r\n`);
    writeFileSync(join(WORK, "notes.contract.yaml"), contract);
    // Every finding kept, so a line or row out of place anywhere in the file shows.
    const r = await agreeInRepo(file, relative(ROOT, join(WORK, "notes.contract.yaml")), ["--max-findings", "100000"]);
    const report = JSON.parse(r.stdout) as { input: { rows: number }; checks: { rule: string; failed: number }[] };
    expect(report.input.rows).toBe(30_000);
    expect(report.checks.find((c) => c.rule.startsWith("key:"))?.failed).toBe(30);
  }, 120_000);
});
