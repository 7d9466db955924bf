import { mkdir, mkdtemp, readFile, rm, writeFile } from "node:fs/promises";
import { availableParallelism } from "node:os";
import { join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { parseArgs } from "node:util";
import { parseDocument } from "yaml";
import { generateDelivery, PROBLEM_KINDS, type GenerateResult } from "./generate.js";
import { measure, median, type Measurement } from "./measure.js";

// Bench: tablegate's full check of a generated delivery against a bare csv-parse pass over the same
// file, each as a whole process, interleaved, median of --runs. Exit 0 unless something failed to run.

const ROOT = fileURLToPath(new URL("../../", import.meta.url));
const PROBE = fileURLToPath(new URL("./rss-probe.js", import.meta.url));
const BARE = fileURLToPath(new URL("./bare-parse.js", import.meta.url));
const CLI = join(ROOT, "bin", "tablegate.js");
const CONTRACT = "contracts/dealer-sales.contract.yaml";

interface Series { readonly label: string; readonly runs: Measurement[] }

function positiveInt(name: string, text: string | undefined, fallback: number): number {
  if (text === undefined) return fallback;
  const n = Number(text);
  if (!Number.isInteger(n) || n < 1) throw new Error(`--${name} expects a positive whole number, got ${text}`);
  return n;
}

function fmt(n: number, digits = 0): string {
  return n.toLocaleString("en-US", { minimumFractionDigits: digits, maximumFractionDigits: digits });
}

function checkArgs(file: string, contract: string, reportPath: string): string[] {
  return ["check", file, "--contract", contract, "--report", `json=${reportPath}`, "--max-findings", "1000"];
}

function failedToRun(m: Measurement, okCodes: readonly number[]): boolean {
  return m.code === null || !okCodes.includes(m.code);
}

function explain(label: string, m: Measurement): string {
  return `${label} exited ${m.code ?? `on signal ${String(m.signal)}`}\n${m.stderrTail.trim()}\n`;
}

function row(s: Series, gen: GenerateResult): string {
  const wall = median(s.runs.map((r) => r.wallMs)) / 1000;
  const rss = s.runs.map((r) => r.maxRssKb).filter((v): v is number => v !== undefined);
  const peak = rss.length > 0 ? `${fmt(Math.max(...rss) / 1024, 0)} MB` : "n/a";
  return (
    `${s.label.padEnd(34)}${`${fmt(wall, 2)} s`.padStart(10)}${fmt(gen.rows / wall).padStart(12)}` +
    `${fmt(gen.bytes / 1e6 / wall, 1).padStart(9)}${peak.padStart(11)}   runs: ${s.runs.map((r) => fmt(r.wallMs / 1000, 2)).join(" ")}`
  );
}

/** Count failures per rule id in a JSON report; undefined when the report is missing or unreadable. */
async function failedByRule(path: string): Promise<Map<string, number> | undefined> {
  let data: unknown;
  try {
    data = JSON.parse(await readFile(path, "utf8"));
  } catch {
    return undefined;
  }
  const checks = typeof data === "object" && data !== null ? (data as { checks?: unknown }).checks : undefined;
  if (!Array.isArray(checks)) return undefined;
  const out = new Map<string, number>();
  for (const c of checks as unknown[]) {
    if (typeof c !== "object" || c === null) continue;
    const { rule, failed } = c as { rule?: unknown; failed?: unknown };
    if (typeof rule === "string" && typeof failed === "number") out.set(rule, failed);
  }
  return out;
}

async function main(): Promise<number> {
  const { values } = parseArgs({
    options: { rows: { type: "string" }, runs: { type: "string" }, dir: { type: "string" }, keep: { type: "boolean", default: false } },
    strict: true,
  });
  const rows = positiveInt("rows", values.rows, 1_000_000);
  const runs = positiveInt("runs", values.runs, 3);

  // The generated file lives in the repository's git-ignored .bench/ by default: tablegate resolves
  // delivery paths against the repository root.
  const parent = values.dir === undefined ? join(ROOT, ".bench") : resolve(values.dir);
  await mkdir(parent, { recursive: true });
  const scratch = await mkdtemp(join(parent, "run-"));
  const t0 = process.hrtime.bigint();
  const gen = await generateDelivery({ rows, path: join(scratch, `dealer-sales-${rows}.csv`) });
  const genSeconds = Number(process.hrtime.bigint() - t0) / 1e9;
  process.stdout.write(`generated ${fmt(rows)} rows, ${fmt(gen.bytes / 1e6, 1)} MB in ${fmt(genSeconds, 1)} s: ${gen.path}\n`);

  try {
    const bare: Series = { label: "bare csv-parse (records counted)", runs: [] };
    const full: Series = { label: "tablegate check (json report)", runs: [] };
    const report = join(scratch, "r.json");
    for (let i = 0; i < runs; i++) {
      const b = await measure({ script: BARE, args: [gen.path], cwd: ROOT, probe: PROBE, scratch });
      if (failedToRun(b, [0])) return fail(explain("bare csv-parse", b));
      // csv-parse without `columns` returns the header as a record too.
      if (!b.stdoutHead.startsWith(`{"records":${rows + 1}}`)) return fail(`bare csv-parse counted ${b.stdoutHead.trim()}, expected ${rows + 1} records\n`);
      bare.runs.push(b);
      await rm(report, { force: true });
      const t = await measure({ script: CLI, args: checkArgs(gen.path, CONTRACT, report), cwd: ROOT, probe: PROBE, scratch });
      // 1 is expected: the generator plants problems on purpose. Node also exits 1 on a crash, so
      // the run counts only when it wrote its report.
      if (failedToRun(t, [0, 1])) return fail(explain("tablegate check", t));
      if ((await failedByRule(report)) === undefined) return fail(`${explain("tablegate check", t)}and wrote no readable JSON report\n`);
      full.runs.push(t);
      process.stdout.write(`run ${i + 1}/${runs}: bare ${fmt(b.wallMs / 1000, 2)} s, tablegate ${fmt(t.wallMs / 1000, 2)} s (exit ${String(t.code)})\n`);
    }

    // Single runs for comparison: without rules, groups and outliers (what those cost on top of the
    // column checks), and with reading and parsing kept on the main thread (what the parse thread saves).
    const stripped = join(scratch, "dealer-sales-columns-only.contract.yaml");
    const doc = parseDocument(await readFile(join(ROOT, CONTRACT), "utf8"));
    for (const key of ["rules", "groups", "outliers"]) doc.delete(key);
    await writeFile(stripped, String(doc));
    const single = async (label: string, contract: string, extra: readonly string[]): Promise<{ series: Series; note?: string }> => {
      const out = join(scratch, "r-single.json");
      await rm(out, { force: true });
      const m = await measure({ script: CLI, args: [...checkArgs(gen.path, contract, out), ...extra], cwd: ROOT, probe: PROBE, scratch });
      const ran = !failedToRun(m, [0, 1]) && (await failedByRule(out)) !== undefined;
      return ran ? { series: { label, runs: [m] } } : { series: { label, runs: [] }, note: `${label}: did not run (${explain("", m).trim()})` };
    };
    // The floor: the same columns as text with nothing to check (no options, keys or duplicates), so
    // only reading, parsing and handing rows to the engine remain.
    const bare16 = join(scratch, "dealer-sales-nothing-checked.contract.yaml");
    const columns = doc.get("columns") as { items: { key: unknown }[] };
    const names = columns.items.map((item) => String((item.key as { value?: unknown }).value ?? item.key));
    await writeFile(bare16, `tablegate: 1\nname: nothing-checked\nduplicates: off\ncolumns:\n${names.map((n) => `  ${n}: { type: text, spaces: allow }\n`).join("")}`);
    const columnsOnly = await single("tablegate, no rules/groups/outliers", stripped, []);
    const nothing = await single("tablegate, nothing checked (floor)", bare16, []);
    const oneThread = await single("tablegate, --parse-thread off", CONTRACT, ["--parse-thread", "off"]);

    const header = `${"".padEnd(34)}${"median".padStart(10)}${"rows/s".padStart(12)}${"MB/s".padStart(9)}${"peak RSS".padStart(11)}`;
    const lines = [
      "",
      `rows ${fmt(rows)}, file ${fmt(gen.bytes / 1e6, 1)} MB, ${runs} interleaved runs each, node ${process.version}, ${availableParallelism()} cores`,
      header,
      row(bare, gen),
      row(full, gen),
    ];
    for (const one of [oneThread, columnsOnly, nothing]) lines.push(one.note ?? row(one.series, gen));
    const ratio = median(full.runs.map((r) => r.wallMs)) / median(bare.runs.map((r) => r.wallMs));
    lines.push(`ratio tablegate / bare csv-parse (median wall time): ${fmt(ratio, 2)}`);
    const cpu = (s: readonly Measurement[]) => median(s.map((r) => r.cpuMs ?? Number.NaN));
    const cpuRatio = cpu(full.runs) / cpu(bare.runs);
    if (Number.isFinite(cpuRatio)) {
      lines.push(`ratio of CPU time, all threads (user + system, median; the work done, where wall time is the wait): ${fmt(cpuRatio, 2)} (${fmt(cpu(full.runs) / 1000, 2)} s against ${fmt(cpu(bare.runs) / 1000, 2)} s)`);
    }
    const columnsRun = columnsOnly.series.runs[0];
    const nothingRun = nothing.series.runs[0];
    const oneThreadRun = oneThread.series.runs[0];
    if (oneThreadRun !== undefined) {
      lines.push(`with reading and parsing on the main thread (--parse-thread off): ratio ${fmt(oneThreadRun.wallMs / median(bare.runs.map((r) => r.wallMs)), 2)} (one run, indicative)`);
    }
    if (columnsRun !== undefined) {
      const share = 1 - columnsRun.wallMs / median(full.runs.map((r) => r.wallMs));
      lines.push(`rules, groups and outliers take about ${fmt(share * 100, 0)}% of tablegate's time (one run, indicative)`);
    }
    if (nothingRun !== undefined) {
      lines.push(`with nothing to check, reading alone: ratio ${fmt(nothingRun.wallMs / median(bare.runs.map((r) => r.wallMs)), 2)} (one run, indicative: the least any contract for this file costs)`);
    }

    const found = await failedByRule(report);
    lines.push("", "planted problems against the report's failure counts (other checks can fire on the same rows):");
    for (const kind of PROBLEM_KINDS) {
      lines.push(`  ${kind.padEnd(30)} planted ${String(gen.planted[kind]).padStart(6)}   reported ${found === undefined ? "n/a" : String(found.get(kind) ?? 0).padStart(6)}`);
    }
    if (found !== undefined) {
      const others = [...found].filter(([rule, n]) => n > 0 && !(PROBLEM_KINDS as readonly string[]).includes(rule));
      for (const [rule, n] of others) lines.push(`  ${rule.padEnd(30)} ${"".padStart(14)}   reported ${String(n).padStart(6)}`);
    }
    process.stdout.write(`${lines.join("\n")}\n`);
    return 0;
  } finally {
    if (values.keep) process.stdout.write(`kept ${scratch}\n`);
    else await rm(scratch, { recursive: true, force: true });
  }
}

function fail(message: string): number {
  process.stderr.write(`bench: ${message}`);
  return 1;
}

main().then(
  (code) => {
    process.exitCode = code;
  },
  (e: unknown) => {
    process.stderr.write(`bench: ${e instanceof Error ? e.message : String(e)}\n`);
    process.exitCode = 1;
  },
);
