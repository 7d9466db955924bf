import { createHash } from "node:crypto";
import { readFile } from "node:fs/promises";
import type { Problem, Result } from "../problem.js";
import type { Registry } from "../registry/index.js";
import { schemaValidator } from "../schema/validator.js";
import { compilePlan } from "./compile.js";
import type { Plan } from "./plan.js";
import { schemaProblems } from "./schema-errors.js";
import type { ContractSpec } from "./types.js";
import { parseYamlSource } from "./yaml-source.js";

export interface LoadOptions {
  readonly registry: Registry;
  /** How problems and the plan name the file; default: the path as given. */
  readonly label?: string;
  /** Days since 1970-01-01 taken as today (tests); default: the real date, UTC. */
  readonly today?: number;
}

/** Parse, validate and compile a contract from its text; `file` names it in every problem. */
export function compileContract(file: string, text: string, options: LoadOptions): Result<Plan> {
  const src = parseYamlSource(file, text);
  if (src.syntaxProblems.length > 0) return { ok: false, problems: src.syntaxProblems };
  const data: unknown = src.doc.toJS({ maxAliasCount: 100 });
  const validator = schemaValidator("contract");
  if (!validator.valid(data)) return { ok: false, problems: schemaProblems(src, data, validator.errors(data)) };
  const sha256 = createHash("sha256").update(text).digest("hex");
  const { plan, problems } = compilePlan({ src, spec: data as ContractSpec, sha256, registry: options.registry, ...(options.today === undefined ? {} : { today: options.today }) });
  return plan ? { ok: true, value: plan } : { ok: false, problems };
}

/** Read and compile a contract file; an unreadable file is a problem naming it. */
export async function loadContract(file: string, options: LoadOptions): Promise<Result<Plan>> {
  let text: string;
  const label = options.label ?? file;
  try {
    text = await readFile(file, "utf8");
  } catch (e) {
    const problem: Problem = { file: label, message: `cannot read contract: ${(e as NodeJS.ErrnoException).code === "ENOENT" ? "no such file" : (e as Error).message}` };
    return { ok: false, problems: [problem] };
  }
  return compileContract(label, text, options);
}
