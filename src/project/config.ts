import { readFile } from "node:fs/promises";
import { join } from "node:path";
import { schemaProblems } from "../contract/schema-errors.js";
import { problemAt, parseYamlSource, yamlData } from "../contract/yaml-source.js";
import { linkOutReason, staysInside } from "./inside.js";
import type { Problem, Result } from "../problem.js";
import { schemaValidator } from "../schema/validator.js";
import { globToRegExp } from "./glob.js";

export const PROJECT_FILE = "tablegate.yaml";

export interface DeliveryRoute {
  readonly globs: readonly string[];
  readonly matchers: readonly RegExp[];
  /** Contract path relative to the root. */
  readonly contract: string;
}

/** The project file, or its defaults when the repository has none. */
export interface ProjectConfig {
  readonly registries: readonly { readonly spec: string; readonly at?: Problem }[];
  readonly routes: readonly DeliveryRoute[];
  readonly present: boolean;
}

/** Read `tablegate.yaml` at the root; absent means no routes and no further registries. */
export async function loadProjectConfig(root: string): Promise<Result<ProjectConfig>> {
  const linked = await linkOutReason(root, PROJECT_FILE);
  if (linked !== undefined) return { ok: false, problems: [{ file: PROJECT_FILE, message: `${PROJECT_FILE} ${linked}` }] };
  let text: string;
  try {
    text = await readFile(join(root, PROJECT_FILE), "utf8");
  } catch {
    return { ok: true, value: { registries: [], routes: [], present: false } };
  }
  const src = parseYamlSource(PROJECT_FILE, text);
  if (src.syntaxProblems.length > 0) return { ok: false, problems: src.syntaxProblems };
  const read = yamlData(src);
  if (!read.ok) return read;
  const data = read.value as {
    registries?: string[];
    deliveries?: { files: string | string[]; contract: string }[];
  };
  const validator = schemaValidator("project");
  if (!validator.valid(data)) return { ok: false, problems: schemaProblems(src, data, validator.errors(data)) };
  const escaping = (data.deliveries ?? []).findIndex((d) => !staysInside(d.contract));
  if (escaping >= 0) return { ok: false, problems: [problemAt(src, ["deliveries", escaping, "contract"], "a contract path is relative to the repository root and stays inside it (no leading / and no .. above the root)")] };
  const routes = (data.deliveries ?? []).map((d) => {
    const globs = typeof d.files === "string" ? [d.files] : d.files;
    return { globs, matchers: globs.map(globToRegExp), contract: d.contract };
  });
  const registries = (data.registries ?? []).map((spec, i) => ({ spec, at: problemAt(src, ["registries", i], "") }));
  return { ok: true, value: { registries, routes, present: true } };
}

/** The contract that claims a root-relative path: the first route whose glob matches. */
export function contractFor(config: ProjectConfig, relPath: string): string | undefined {
  return config.routes.find((r) => r.matchers.some((m) => m.test(relPath)))?.contract;
}
