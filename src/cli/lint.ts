import { isAbsolute, join } from "node:path";
import { formatProblem } from "../problem.js";
import { loadProjectConfig } from "../project/config.js";
import { loadRegistry } from "../registry/index.js";
import { loadPlan } from "./check.js";
import { EXIT, type Io } from "./io.js";
import { badArgument, commandArgs, showUsage, unusable } from "./problems.js";
import { findRoot, reportPath } from "./root.js";

export const LINT_USAGE = "tablegate lint <contract...>";

/** `tablegate lint <contract...>`: check contracts (and the registry they use) without data. */
export async function lint(argv: readonly string[], io: Io): Promise<number> {
  // No options but --help; parsing still tells an unknown option from a contract file name.
  const parsed = commandArgs(io, "lint", argv, { help: { type: "boolean", short: "h" } });
  if (typeof parsed === "number") return parsed;
  if (parsed.values.help === true) return showUsage(io, LINT_USAGE);
  const files = parsed.positionals;
  if (files.length === 0) return badArgument(io, "lint", "lint needs at least one contract file");
  const root = findRoot(io.cwd);
  const config = await loadProjectConfig(root);
  if (!config.ok) return unusable(io, config.problems);
  const registry = await loadRegistry(root, config.value.registries);
  if (!registry.ok) return unusable(io, registry.problems);
  let bad = 0;
  for (const file of files) {
    const path = isAbsolute(file) ? file : join(io.cwd, file);
    const shown = reportPath(root, path);
    // The same load as check: a contract whose tables left their lock is refused here too.
    const loaded = await loadPlan(root, shown, registry.value);
    if (loaded.ok) {
      io.stdout(`${shown}: ok (${loaded.value.checks.length} checks)\n`);
      continue;
    }
    bad++;
    for (const p of loaded.problems) io.stderr(`tablegate: ${formatProblem({ ...p, file: p.file })}\n`);
  }
  return bad > 0 ? EXIT.unusable : EXIT.pass;
}
