import { isAbsolute, join } from "node:path";
import { parseArgs } from "node:util";
import { checkFile } from "../check.js";
import { loadContract } from "../contract/load.js";
import type { Plan } from "../contract/plan.js";
import type { Problem } from "../problem.js";
import type { DeliveryReport, Level } from "../report/model.js";
import { loadRegistry, verifyLock, type Registry } from "../registry/index.js";
import { EXIT, type Io } from "./io.js";
import { badArgument, unusable } from "./problems.js";
import { parseReportTargets, writeReports } from "./reports.js";
import { findRoot, reportPath } from "./root.js";

export const CHECK_USAGE = "tablegate check <file...> [--contract <c>] [--report <format>=<path>]... [--max-findings N] [--fail-on error|warning]";

/** `tablegate check`: judge deliveries against contracts; 0 pass, 1 fail, 2 could not judge. */
export async function check(argv: readonly string[], io: Io): Promise<number> {
  let args;
  try {
    args = parseArgs({
      args: [...argv],
      allowPositionals: true,
      options: {
        contract: { type: "string", short: "c" },
        report: { type: "string", short: "r", multiple: true },
        "max-findings": { type: "string" },
        "fail-on": { type: "string" },
      },
    });
  } catch (e) {
    return badArgument(io, `${(e as Error).message}\nusage: ${CHECK_USAGE}`);
  }
  const { values, positionals } = args;
  if (positionals.length === 0) return badArgument(io, `check needs at least one delivery file\nusage: ${CHECK_USAGE}`);
  const maxFindings = values["max-findings"] === undefined ? 1000 : Number(values["max-findings"]);
  if (!Number.isInteger(maxFindings) || maxFindings < 0) return badArgument(io, `invalid option --max-findings: expected a whole number, got ${JSON.stringify(values["max-findings"])}`);
  const failOn = values["fail-on"] ?? "error";
  if (failOn !== "error" && failOn !== "warning") return badArgument(io, `invalid option --fail-on: expected error or warning, got ${JSON.stringify(failOn)}`);
  const targets = parseReportTargets(values.report ?? []);
  if (!targets.ok) return badArgument(io, targets.message);
  if (values.contract === undefined) return badArgument(io, "check needs --contract <file> (mapping files to contracts through tablegate.yaml comes with project configuration)");

  const root = findRoot(io.cwd);
  const registry = await loadRegistry(root);
  if (!registry.ok) return unusable(io, registry.problems);
  const plan = await loadPlan(root, values.contract, registry.value, io);
  if (!plan.ok) return unusable(io, plan.problems);
  const reports: DeliveryReport[] = [];
  for (const file of positionals) {
    const r = await checkFile(plan.value, resolvePath(io.cwd, file), {
      reportPath: reportPath(root, resolvePath(io.cwd, file)),
      contractPath: reportPath(root, resolvePath(io.cwd, values.contract)),
      maxFindings,
      failOn: failOn as Level,
    });
    if (!r.ok) return unusable(io, r.problems);
    reports.push(r.value);
  }
  const written = await writeReports(reports, targets.value, io, root);
  if (!written.ok) return unusable(io, written.problems);
  return reports.some((r) => r.verdict === "fail") ? EXIT.fail : EXIT.pass;
}

function resolvePath(cwd: string, p: string): string {
  return isAbsolute(p) ? p : join(cwd, p);
}

async function loadPlan(root: string, contract: string, registry: Registry, io: Io): Promise<{ ok: true; value: Plan } | { ok: false; problems: readonly Problem[] }> {
  const path = resolvePath(io.cwd, contract);
  const shown = reportPath(root, path);
  const loaded = await loadContract(path, { registry });
  if (!loaded.ok) return { ok: false, problems: loaded.problems.map((p) => ({ ...p, file: p.file === path ? shown : p.file })) };
  const lock = await verifyLock(root, registry, loaded.value.references.map((r) => r.table));
  if (!lock.ok) return lock;
  return loaded;
}
