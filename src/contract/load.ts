import { createHash } from "node:crypto";
import { isUtf8 } from "node:buffer";
import { readFile } from "node:fs/promises";
import { firstInvalid } from "../input/utf8.js";
import type { Problem, Result } from "../problem.js";
import type { Registry } from "../registry/index.js";
import { schemaValidator } from "../schema/validator.js";
import { compilePlan } from "./compile.js";
import type { Plan } from "./plan.js";
import { schemaProblems } from "./schema-errors.js";
import type { ContractSpec } from "./types.js";
import { parseYamlSource, yamlData } from "./yaml-source.js";

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
  const read = yamlData(src);
  if (!read.ok) return read;
  const data = read.value;
  const validator = schemaValidator("contract");
  if (!validator.valid(data)) return { ok: false, problems: schemaProblems(src, data, validator.errors(data)) };
  const sha256 = createHash("sha256").update(text).digest("hex");
  const { plan, problems } = compilePlan({ src, spec: data as ContractSpec, sha256, registry: options.registry, ...(options.today === undefined ? {} : { today: options.today }) });
  return plan ? { ok: true, value: plan } : { ok: false, problems };
}

/** Read and compile a contract file; an unreadable file is a problem naming it. */
export async function loadContract(file: string, options: LoadOptions): Promise<Result<Plan>> {
  let bytes: Buffer;
  const label = options.label ?? file;
  try {
    bytes = await readFile(file);
  } catch (e) {
    const problem: Problem = { file: label, message: `cannot read contract: ${(e as NodeJS.ErrnoException).code === "ENOENT" ? "no such file" : (e as Error).message}` };
    return { ok: false, problems: [problem] };
  }
  // YAML 1.2 files are Unicode; a byte that is not UTF-8 would silently become U+FFFD in a name or code.
  if (!isUtf8(bytes)) return { ok: false, problems: [{ file: label, ...firstBadByte(bytes), message: "the contract is not valid UTF-8 here; save it as UTF-8" }] };
  return compileContract(label, bytes.toString("utf8"), options);
}

/** Line and column (in characters) of the first byte that breaks UTF-8. */
function firstBadByte(bytes: Buffer): { line: number; column: number } {
  const at = Math.max(0, firstInvalid(bytes, 0, bytes.length));
  const lines = bytes.subarray(0, at).toString("utf8").split("\n");
  return { line: lines.length, column: (lines[lines.length - 1]?.length ?? 0) + 1 };
}
