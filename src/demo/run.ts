import { spawn } from "node:child_process";
import { mkdir, readFile, rm } from "node:fs/promises";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { parseArgs } from "node:util";
import { parse as parseCsv } from "csv-parse/sync";
import { parse as parseYaml } from "yaml";
import { compareReport, leakedValues } from "./compare.js";
import { CONTRACT, REPORT_FILES, WEEK_47, WEEK_48, type DeliveryOutcome } from "./expected.js";

// The demo runs tablegate the way a user does, as `node bin/tablegate.js` in its own process, on
// a delivery with planted problems and on a clean one, and exits 0 only when both came out as designed.

const ROOT = fileURLToPath(new URL("../../", import.meta.url));
const CLI = join(ROOT, "bin", "tablegate.js");

interface CliRun { readonly code: number | null; readonly stdout: string; readonly stderr: string }

function runCli(args: readonly string[]): Promise<CliRun> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [CLI, ...args], { cwd: ROOT, stdio: ["ignore", "pipe", "pipe"] });
    let stdout = "";
    let stderr = "";
    child.stdout.setEncoding("utf8").on("data", (t: string) => (stdout += t));
    child.stderr.setEncoding("utf8").on("data", (t: string) => (stderr += t));
    child.once("error", reject);
    child.once("close", (code) => resolve({ code, stdout, stderr }));
  });
}

function checkArgs(file: string, reports: readonly string[]): string[] {
  return ["check", file, "--contract", CONTRACT, ...reports.flatMap((r) => ["--report", r])];
}

/** Raw texts of the contract's sensitive columns in a sample, whole cells and each `;`-separated part. */
async function sensitiveTexts(sample: string): Promise<Set<string>> {
  const contract: unknown = parseYaml(await readFile(join(ROOT, CONTRACT), "utf8"));
  const columns = (contract as { columns?: Record<string, { sensitive?: boolean }> }).columns ?? {};
  const names = Object.entries(columns).filter(([, c]) => c.sensitive === true).map(([n]) => n);
  const records = parseCsv(await readFile(join(ROOT, sample)), { columns: true, skip_empty_lines: true }) as Record<string, string>[];
  const out = new Set<string>();
  for (const r of records) {
    for (const n of names) {
      const cell = (r[n] ?? "").trim();
      if (cell === "") continue;
      out.add(cell);
      for (const part of cell.split(";")) if (part.trim() !== "") out.add(part.trim());
    }
  }
  return out;
}

async function readJson(path: string): Promise<unknown> {
  try {
    return JSON.parse(await readFile(join(ROOT, path), "utf8"));
  } catch (e) {
    return `unreadable: ${(e as Error).message}`;
  }
}

function exitDiff(label: string, run: CliRun, expect: DeliveryOutcome): string[] {
  if (run.code === expect.exitCode) return [];
  return [`${label}: exit ${String(run.code)}, expected ${expect.exitCode}${run.stderr.trim() === "" ? "" : `: ${run.stderr.trim()}`}`];
}

async function main(): Promise<number> {
  const { values } = parseArgs({ options: { out: { type: "string", default: "demo-output" } }, strict: true });
  const out = values.out;
  await mkdir(join(ROOT, out), { recursive: true });
  // Reports left by an earlier run must not pass for this run's.
  for (const file of [...Object.values(REPORT_FILES), "w47.json"]) await rm(join(ROOT, out, file), { force: true });
  const say = (text: string): void => void process.stdout.write(text);
  const diffs: string[] = [];

  const w48Args = checkArgs(WEEK_48.file, [`json=${join(out, REPORT_FILES["json"] ?? "")}`, `text=${join(out, REPORT_FILES["text"] ?? "")}`]);
  say(
    "Cairnhollow Trail Supply (invented) receives a sell-through file from each partner dealer every week.\n" +
      `Contract: ${CONTRACT}\n\n== Week 48: a delivery with problems ==\n$ tablegate ${w48Args.join(" ")}\n\n`,
  );
  const w48 = await runCli(w48Args);
  say(w48.stdout);
  if (w48.stderr !== "") process.stderr.write(w48.stderr);
  diffs.push(...exitDiff("week 48", w48, WEEK_48));
  diffs.push(...compareReport(await readJson(join(out, REPORT_FILES["json"] ?? "")), WEEK_48).map((d) => `week 48: ${d}`));

  // Every other format, one run each, so that a missing writer is named on its own.
  const outputs: { readonly name: string; readonly text: string }[] = [{ name: "stdout", text: w48.stdout }];
  for (const [format, file] of Object.entries(REPORT_FILES)) {
    const path = join(out, file);
    if (format !== "json" && format !== "text") {
      const r = await runCli(checkArgs(WEEK_48.file, [`${format}=${path}`]));
      if (r.code !== WEEK_48.exitCode) diffs.push(`week 48, ${format} report: exit ${String(r.code)}, expected ${WEEK_48.exitCode}: ${r.stderr.trim()}`);
    }
    let text = "";
    try {
      text = await readFile(join(ROOT, path), "utf8");
    } catch {
      diffs.push(`week 48, ${format} report: ${path} was not written`);
      continue;
    }
    if (text.trim() === "") diffs.push(`week 48, ${format} report: ${path} is empty`);
    outputs.push({ name: path, text });
  }
  const secrets = await sensitiveTexts(WEEK_48.file);
  for (const o of outputs) {
    for (const leak of leakedValues(o.text, secrets)) diffs.push(`week 48: sensitive value ${JSON.stringify(leak)} appears unmasked in ${o.name}`);
  }
  say(`\nReports written: ${outputs.slice(1).map((o) => o.name).join(", ")}\n`);

  const w47Args = checkArgs(WEEK_47.file, [`json=${join(out, "w47.json")}`]);
  say(`\n== Week 47: a clean delivery ==\n$ tablegate ${w47Args.join(" ")}\n\n`);
  const w47 = await runCli(w47Args);
  say(w47.stdout);
  if (w47.stderr !== "") process.stderr.write(w47.stderr);
  diffs.push(...exitDiff("week 47", w47, WEEK_47));
  diffs.push(...compareReport(await readJson(join(out, "w47.json")), WEEK_47).map((d) => `week 47: ${d}`));

  say("\n== What week 48 was built to show ==\n");
  for (const [rule, f] of Object.entries(WEEK_48.failures)) say(`  ${rule.padEnd(28)} ${f.planted}\n`);
  if (diffs.length === 0) {
    say(`\nDemo ran as designed: week 48 exit 1 with ${Object.keys(WEEK_48.failures).length} expected checks failing, week 47 exit 0, no sensitive value unmasked.\n`);
    return 0;
  }
  say(`\nDemo did NOT run as designed (${diffs.length} differences):\n${diffs.map((d) => `  - ${d}`).join("\n")}\n`);
  return 1;
}

main().then(
  (code) => {
    process.exitCode = code;
  },
  (e: unknown) => {
    process.stderr.write(`demo: ${e instanceof Error ? e.message : String(e)}\n`);
    process.exitCode = 1;
  },
);
