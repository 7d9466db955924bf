import { isAbsolute, join, relative, sep } from "node:path";
import { compileContract } from "../contract/load.js";
import { formatFromName, inferContract, nameFromFile } from "../infer/index.js";
import type { Registry } from "../registry/index.js";
import { schemaPath } from "../schema/locate.js";
import { EXIT, type Io } from "./io.js";
import { badArgument, commandArgs, showUsage, unusable } from "./problems.js";
import { findRoot, reportPath } from "./root.js";
import { linkOutReason } from "../project/inside.js";

export const INFER_USAGE = "tablegate infer <file> [--name <n>]";

const OPTIONS = { name: { type: "string", short: "n" }, help: { type: "boolean", short: "h" } } as const;

// A draft names no registry table, so it compiles against none.
const NO_TABLES: Registry = { table: () => undefined, tables: () => [] };

/**
 * `tablegate infer`: a draft contract for one delivery on stdout; 0 done, 2 bad arguments or a file
 * that cannot be read to its end (a draft of part of a file would describe a file that does not exist).
 */
export async function infer(argv: readonly string[], io: Io): Promise<number> {
  const parsed = commandArgs(io, "infer", argv, OPTIONS);
  if (typeof parsed === "number") return parsed;
  const { values, positionals } = parsed;
  if (values.help === true) return showUsage(io, INFER_USAGE);
  if (positionals.length !== 1) return badArgument(io, "infer", `infer takes one delivery file, got ${positionals.length}`);
  const file = positionals[0] as string;
  const format = formatFromName(file);
  if (format === undefined) return badArgument(io, "infer", `${file}: cannot tell the format from the name: expected .csv, .tsv, .ndjson or .jsonl, optionally .gz`);
  const name = values.name ?? nameFromFile(file);
  if (!/^[a-z0-9][a-z0-9-]*$/.test(name)) return badArgument(io, "infer", `invalid option --name: expected lower-case letters, digits and dashes, got ${JSON.stringify(name)}`);

  const root = findRoot(io.cwd);
  const path = isAbsolute(file) ? file : join(io.cwd, file);
  const shown = reportPath(root, path);
  const linked = await linkOutReason(root, path);
  if (linked !== undefined) return unusable(io, [{ file: shown, message: `delivery ${linked}` }]);
  const inferred = await inferContract(path, { format, name, file: shown, schema: schemaLink(root) });
  if (!inferred.ok) return unusable(io, inferred.problems.map((p) => ({ ...p, file: p.file === path ? shown : p.file })));

  // A draft that the checker refuses would be a bug here; say so instead of printing it.
  const compiled = compileContract(`${name}.contract.yaml (draft)`, inferred.value.text, { registry: NO_TABLES });
  if (!compiled.ok) return unusable(io, compiled.problems.map((p) => ({ ...p, message: `internal error, the draft is not a valid contract: ${p.message}` })));
  io.stdout(inferred.value.text);
  for (const r of inferred.value.draft.warnings) io.stderr(`tablegate: ${shown}: note: ${r}\n`);
  return EXIT.pass;
}

/** The shipped contract schema, relative to the working folder when inside it, else absolute. */
/**
 * The schema as a contract in `<root>/contracts/` (SPEC §1's place for contracts) reaches it, since
 * editors resolve `$schema` from the file; absolute when the schema lies outside the repository.
 */
function schemaLink(root: string): string {
  const abs = schemaPath("contract.schema.json");
  const fromRoot = relative(root, abs);
  const inside = !fromRoot.startsWith("..") && !isAbsolute(fromRoot);
  return (inside ? relative(join(root, "contracts"), abs) : abs).split(sep).join("/");
}
