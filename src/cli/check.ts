import { isAbsolute, join, resolve } from "node:path";
import { stat } from "node:fs/promises";
import { checkFile } from "../check.js";
import { loadContract } from "../contract/load.js";
import type { Plan } from "../contract/plan.js";
import type { Problem, Result } from "../problem.js";
import { contractFor, loadProjectConfig, type ProjectConfig } from "../project/config.js";
import { changedSince, DATA_FILE, routedFiles } from "../project/files.js";
import { linkOutReason } from "../project/inside.js";
import type { DeliveryReport, Level } from "../report/model.js";
import { loadRegistry, verifyLock, type Registry } from "../registry/index.js";
import { EXIT, type Io } from "./io.js";
import { badArgument, commandArgs, showUsage, unusable } from "./problems.js";
import { createProgress } from "./progress.js";
import { parseReportTargets, writeReports } from "./reports.js";
import { findRoot, reportPath } from "./root.js";

export const CHECK_USAGE =
  "tablegate check [<file...>] [--contract <c>] [--report <format>=<path>]... [--max-findings N] [--fail-on error|warning] [--changed-since <git-rev>] [--require-contract] [--parse-thread auto|on|off]";

const OPTIONS = {
  contract: { type: "string", short: "c" },
  report: { type: "string", short: "r", multiple: true },
  "max-findings": { type: "string" },
  "fail-on": { type: "string" },
  "changed-since": { type: "string" },
  "require-contract": { type: "boolean" },
  "parse-thread": { type: "string" },
  help: { type: "boolean", short: "h" },
} as const;

interface Job {
  readonly file: string;
  readonly contract: string;
}

/**
 * `tablegate check`: judge deliveries against contracts; 0 pass, 1 fail, 2 could not judge.
 * Without --contract, tablegate.yaml routes each file (or, with no files named, every file its
 * globs match) to its contract.
 */
export async function check(argv: readonly string[], io: Io): Promise<number> {
  const parsed = commandArgs(io, "check", argv, OPTIONS);
  if (typeof parsed === "number") return parsed;
  const { values, positionals } = parsed;
  if (values.help === true) return showUsage(io, CHECK_USAGE);
  const maxFindings = values["max-findings"] === undefined ? 1000 : Number(values["max-findings"]);
  if (!/^\d+$/.test(values["max-findings"] ?? "0")) return badArgument(io, "check", `invalid option --max-findings: expected a whole number, got ${JSON.stringify(values["max-findings"])}`);
  const failOn = values["fail-on"] ?? "error";
  if (failOn !== "error" && failOn !== "warning") return badArgument(io, "check", `invalid option --fail-on: expected error or warning, got ${JSON.stringify(failOn)}`);
  const parseThread = values["parse-thread"] ?? "auto";
  if (parseThread !== "auto" && parseThread !== "on" && parseThread !== "off") return badArgument(io, "check", `invalid option --parse-thread: expected auto, on or off, got ${JSON.stringify(parseThread)}`);
  const targets = parseReportTargets(values.report ?? []);
  if (!targets.ok) return badArgument(io, "check", targets.message);

  const root = findRoot(io.cwd);
  const config = await loadProjectConfig(root);
  if (!config.ok) return unusable(io, config.problems);
  const rel = (p: string) => reportPath(root, isAbsolute(p) ? p : join(io.cwd, p));
  const planned = await planJobs(root, config.value, positionals.map(rel), values.contract === undefined ? undefined : rel(values.contract), values["changed-since"]);
  if (!planned.ok) {
    // Problems filed under "check" are about the arguments (no contract, no files): point at --help.
    const [first] = planned.problems;
    return planned.problems.length === 1 && first?.file === "check" ? badArgument(io, "check", first.message) : unusable(io, planned.problems);
  }
  const { jobs, unclaimed } = planned.value;
  if (jobs.length === 0 && unclaimed.length === 0 && values["changed-since"] === undefined) {
    return badArgument(io, "check", "nothing to check: name delivery files, or list deliveries in tablegate.yaml");
  }

  const registry = await loadRegistry(root, config.value.registries);
  if (!registry.ok) return unusable(io, registry.problems);
  const plans = new Map<string, Plan>();
  const reports: DeliveryReport[] = [];
  for (const job of jobs) {
    let plan = plans.get(job.contract);
    if (!plan) {
      const loaded = await loadPlan(root, job.contract, registry.value);
      if (!loaded.ok) return unusable(io, loaded.problems);
      plan = loaded.value;
      plans.set(job.contract, plan);
    }
    const path = resolve(root, job.file);
    const linked = await linkOutReason(root, path);
    if (linked !== undefined) return unusable(io, [{ file: job.file, message: `delivery ${linked}` }]);
    const size = io.stderrIsTty ? ((await stat(path).catch(() => undefined))?.size ?? 0) : 0;
    let read = 0;
    const progress = io.stderrIsTty ? createProgress(io.stderr, job.file, size, () => read) : undefined;
    const r = await checkFile(plan, path, {
      reportPath: job.file,
      contractPath: job.contract,
      maxFindings,
      failOn: failOn as Level,
      parseThread,
      profile: targets.value.some((t) => t.format === "html"),
      ...(progress
        ? {
            onProgress: (rows: number, bytes: number) => {
              read = bytes;
              progress.update(rows);
            },
          }
        : {}),
    });
    progress?.done();
    if (!r.ok) return unusable(io, r.problems.map((p) => ({ ...p, file: p.file === path ? job.file : p.file })));
    reports.push(r.value);
  }
  const written = await writeReports(reports, targets.value, io, root, unclaimed, values["require-contract"] === true);
  if (!written.ok) return unusable(io, written.problems);
  const failed = reports.some((r) => r.verdict === "fail") || (values["require-contract"] === true && unclaimed.length > 0);
  return failed ? EXIT.fail : EXIT.pass;
}

/** Pair each delivery with its contract; files no contract claims are returned apart. */
async function planJobs(root: string, config: ProjectConfig, files: string[], contract: string | undefined, since: string | undefined): Promise<Result<{ jobs: Job[]; unclaimed: string[] }>> {
  let changed: Set<string> | undefined;
  if (since !== undefined) {
    const c = await changedSince(root, since);
    if (!c.ok) return c;
    changed = new Set(c.value);
  }
  let candidates = files;
  if (candidates.length === 0) {
    if (contract !== undefined) return { ok: false, problems: [{ file: "check", message: `name the delivery files to check against ${contract}` }] };
    // Code lists are reviewed through the registry (`ref lint`), not as deliveries: a changed table is no unclaimed file.
    const registryFolders = ["reference/", ...config.registries.map((r) => r.spec).filter((s) => s.startsWith("./")).map((s) => `${s.slice(2).replace(/\/+$/, "")}/`)];
    const inRegistry = (f: string) => registryFolders.some((dir) => f.startsWith(dir));
    candidates = changed ? [...changed].filter((f) => (DATA_FILE.test(f) && !inRegistry(f)) || contractFor(config, f) !== undefined) : await routedFiles(root, config);
  }
  if (changed) candidates = candidates.filter((f) => changed.has(f));
  if (contract !== undefined) return { ok: true, value: { jobs: candidates.map((file) => ({ file, contract })), unclaimed: [] } };
  if (!config.present) {
    return { ok: false, problems: [{ file: "check", message: "no --contract given and no tablegate.yaml at the repository root to say which contract judges which file" }] };
  }
  const jobs: Job[] = [];
  const unclaimed: string[] = [];
  for (const file of candidates) {
    const c = contractFor(config, file);
    if (c === undefined) unclaimed.push(file);
    else jobs.push({ file, contract: c });
  }
  return { ok: true, value: { jobs, unclaimed } };
}

/** Compile a contract (root-relative path) against the registry, refusing tables that left their lock. */
export async function loadPlan(root: string, contract: string, registry: Registry): Promise<Result<Plan>> {
  const linked = await linkOutReason(root, contract);
  if (linked !== undefined) return { ok: false, problems: [{ file: contract, message: `contract ${linked}` }] };
  const loaded = await loadContract(resolve(root, contract), { registry, label: contract });
  if (!loaded.ok) return loaded;
  const lock = await verifyLock(root, registry, loaded.value.references.map((r) => r.table));
  return lock.ok ? loaded : (lock as { ok: false; problems: readonly Problem[] });
}
