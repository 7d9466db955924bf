import { isAbsolute, join } from "node:path";
import { fixFile } from "../fix/fix-file.js";
import { fixSummary } from "../fix/summary.js";
import { checkTargets, type FixTargets } from "../fix/targets.js";
import { contractFor, loadProjectConfig } from "../project/config.js";
import { loadRegistry } from "../registry/index.js";
import { linkOutReason } from "../project/inside.js";
import { loadPlan } from "./check.js";
import { EXIT, type Io } from "./io.js";
import { badArgument, commandArgs, showUsage, unusable } from "./problems.js";
import { findRoot, reportPath } from "./root.js";

export const FIX_USAGE = "tablegate fix <file> --contract <c> --out <clean> --rejects <rejects> --log <changes.ndjson>";

const OPTIONS = {
  contract: { type: "string", short: "c" },
  out: { type: "string" },
  rejects: { type: "string" },
  log: { type: "string" },
  help: { type: "boolean", short: "h" },
} as const;

/**
 * `tablegate fix`: repair a delivery mechanically and split it into clean and rejected records, with
 * a log of every change; 0 every record is clean and the clean file meets the contract, 1 some record
 * was rejected or the clean file still fails a whole-file check, 2 it could not run.
 */
export async function fix(argv: readonly string[], io: Io): Promise<number> {
  const parsed = commandArgs(io, "fix", argv, OPTIONS);
  if (typeof parsed === "number") return parsed;
  const { values, positionals } = parsed;
  if (values.help === true) return showUsage(io, FIX_USAGE);
  if (positionals.length !== 1) return badArgument(io, "fix", `fix takes exactly one delivery file, got ${positionals.length}`);
  for (const key of ["out", "rejects", "log"] as const) {
    if (values[key] === undefined || values[key] === "") return badArgument(io, "fix", `missing option --${key}`);
  }
  const abs = (p: string) => (isAbsolute(p) ? p : join(io.cwd, p));
  const input = abs(positionals[0] as string);
  const targets: FixTargets = { out: abs(values.out as string), rejects: abs(values.rejects as string), log: abs(values.log as string) };
  const shown: FixTargets = { out: values.out as string, rejects: values.rejects as string, log: values.log as string };
  const checked = await checkTargets(input, targets, { out: "--out", rejects: "--rejects", log: "--log" });
  if (!checked.ok) return unusable(io, checked.problems);

  const root = findRoot(io.cwd);
  const config = await loadProjectConfig(root);
  if (!config.ok) return unusable(io, config.problems);
  const inputLabel = reportPath(root, input);
  const contract = values.contract === undefined ? contractFor(config.value, inputLabel) : reportPath(root, abs(values.contract));
  if (contract === undefined) {
    return badArgument(io, "fix", `no --contract given and no tablegate.yaml entry claims ${inputLabel}`);
  }
  const registry = await loadRegistry(root, config.value.registries);
  if (!registry.ok) return unusable(io, registry.problems);
  const loaded = await loadPlan(root, contract, registry.value);
  if (!loaded.ok) return unusable(io, loaded.problems);

  const linked = await linkOutReason(root, input);
  if (linked !== undefined) return unusable(io, [{ file: inputLabel, message: `delivery ${linked}` }]);
  const r = await fixFile(loaded.value, input, targets, { input: inputLabel, contract, out: shown.out });
  if (!r.ok) return unusable(io, r.problems.map((p) => ({ ...p, file: p.file === input ? inputLabel : p.file })));
  io.stderr(fixSummary(r.value, inputLabel, contract, shown));
  return r.value.rejectedRows > 0 || r.value.cleanVerdict === "fail" ? EXIT.fail : EXIT.pass;
}
