import { spawn } from "node:child_process";
import { readFile, rm } from "node:fs/promises";
import { join } from "node:path";

/** One finished child process: its exit code, wall time and peak resident set size. */
export interface Measurement {
  readonly code: number | null;
  readonly signal: NodeJS.Signals | null;
  readonly wallMs: number;
  /** Peak RSS in kilobytes as getrusage reports it; undefined when the child wrote none. */
  readonly maxRssKb: number | undefined;
  /** User + system CPU time in milliseconds; undefined when the child wrote none. */
  readonly cpuMs: number | undefined;
  /** The last few kilobytes of the child's stderr, for messages when it failed. */
  readonly stderrTail: string;
  /** The first few kilobytes of the child's stdout. */
  readonly stdoutHead: string;
}

export interface MeasureOptions {
  /** Node script to run and its arguments. */
  readonly script: string;
  readonly args: readonly string[];
  readonly cwd: string;
  /** Absolute path of the compiled rss-probe.js, preloaded with --import. */
  readonly probe: string;
  /** Scratch folder for the probe's output file. */
  readonly scratch: string;
}

const TAIL_BYTES = 4096;

/** Run `node <script> <args>` as its own process and measure it from spawn to close. */
export async function measure(options: MeasureOptions): Promise<Measurement> {
  const rssFile = join(options.scratch, `rss-${process.pid}-${Date.now()}.txt`);
  await rm(rssFile, { force: true });
  const start = process.hrtime.bigint();
  const child = spawn(process.execPath, ["--import", options.probe, options.script, ...options.args], {
    cwd: options.cwd,
    env: { ...process.env, TABLEGATE_BENCH_RSS_FILE: rssFile, NO_COLOR: "1" },
    stdio: ["ignore", "pipe", "pipe"],
  });
  // stdout beyond its head is drained and dropped so that a chatty child never blocks on a full pipe.
  let head = "";
  child.stdout.setEncoding("utf8");
  child.stdout.on("data", (text: string) => {
    if (head.length < TAIL_BYTES) head += text.slice(0, TAIL_BYTES - head.length);
  });
  let tail = "";
  child.stderr.setEncoding("utf8");
  child.stderr.on("data", (text: string) => {
    tail = (tail + text).slice(-TAIL_BYTES);
  });
  const [code, signal] = await new Promise<[number | null, NodeJS.Signals | null]>((resolve, reject) => {
    child.once("error", reject);
    child.once("close", (c, s) => resolve([c, s]));
  });
  const wallMs = Number(process.hrtime.bigint() - start) / 1e6;
  let maxRssKb: number | undefined;
  let cpuMs: number | undefined;
  try {
    const [rss, cpu] = (await readFile(rssFile, "utf8")).trim().split(" ").map(Number);
    maxRssKb = rss !== undefined && Number.isFinite(rss) && rss > 0 ? rss : undefined;
    cpuMs = cpu !== undefined && Number.isFinite(cpu) && cpu > 0 ? cpu : undefined;
  } catch {
    maxRssKb = undefined;
  }
  await rm(rssFile, { force: true });
  return { code, signal, wallMs, maxRssKb, cpuMs, stderrTail: tail, stdoutHead: head };
}

/** Median of a non-empty list (mean of the middle two for an even count). */
export function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  const upper = sorted[mid] ?? Number.NaN;
  return sorted.length % 2 === 1 ? upper : ((sorted[mid - 1] ?? Number.NaN) + upper) / 2;
}
