import { stat } from "node:fs/promises";
import { join, resolve } from "node:path";
import { fail, ok, type Problem, type Result } from "../problem.js";
import { builtInTables } from "./builtins.js";
import { loadManifestFile } from "./manifest-folder.js";
import { isInside, repoLabel, resolveInside } from "./paths.js";
import type { RefTable } from "./ref-table.js";
import { linkOutReason } from "../project/inside.js";

/** The tables of one run, by name. */
export interface Registry {
  table(name: string): RefTable | undefined;
  /** built-ins first, then the repository's own tables, then those of further roots, each in manifest order */
  tables(): readonly RefTable[];
  /**
   * Tables the manifests declare but that did not load (a repeated key, a missing file...), with
   * their problems. They block only what uses them: a contract naming one, `ref show` of it, `ref lock`.
   */
  broken?(): ReadonlyMap<string, readonly Problem[]>;
}

/**
 * A further registry, as listed in tablegate.yaml: a folder written with a leading `./` (relative to the
 * repository root) holding a registry.yaml, or the name of an installed npm package whose root (or
 * `reference/` folder) holds one. `at` is where the entry is written, for "not found" problems.
 */
export type RegistryRoot = string | { readonly spec: string; readonly at?: Problem };

/** The repository's own manifest, relative to the repository root. */
export const REPO_MANIFEST = "reference/registry.yaml";

const NPM_NAME = /^(@[a-z0-9][a-z0-9._~-]*\/)?[a-z0-9][a-z0-9._~-]*$/;

async function isFile(abs: string): Promise<boolean> {
  try {
    return (await stat(abs)).isFile();
  } catch {
    return false;
  }
}

/** Find the registry.yaml a root names; folders must stay inside the repository. */
async function resolveRoot(repoRoot: string, root: RegistryRoot): Promise<Result<string>> {
  const spec = typeof root === "string" ? root : root.spec;
  const at: Problem = typeof root === "string" || !root.at ? { file: "tablegate.yaml", message: "" } : root.at;
  const problem = (message: string): Result<string> => fail({ ...at, message });
  if (spec.startsWith("./") || spec.startsWith("../") || spec.startsWith("/") || spec === ".") {
    const found = await resolveInside(repoRoot, spec);
    if ("escapes" in found) return problem(`registry folder ${spec} lies outside the repository`);
    if ("missing" in found) return problem(`registry folder ${spec} does not exist`);
    const manifest = join(found.abs, "registry.yaml");
    return (await isFile(manifest)) ? { ok: true, value: manifest } : problem(`registry folder ${spec} has no registry.yaml`);
  }
  if (!NPM_NAME.test(spec)) return problem(`"${spec}" is neither a folder (write ./${spec}) nor an npm package name`);
  const pkg = resolve(repoRoot, "node_modules", spec);
  if (!isInside(repoRoot, pkg)) return problem(`"${spec}" is not an npm package name`);
  for (const candidate of [join(pkg, "registry.yaml"), join(pkg, "reference", "registry.yaml")]) {
    if (await isFile(candidate)) return ok(candidate);
  }
  return (await isFile(join(pkg, "package.json")))
    ? problem(`npm package ${spec} ships no registry.yaml (looked in its root and its reference/ folder)`)
    : problem(`npm package ${spec} is not installed (run npm install)`);
}

function makeRegistry(list: readonly RefTable[], broken: ReadonlyMap<string, readonly Problem[]>): Registry {
  const byName = new Map(list.map((t) => [t.name, t] as const));
  return { table: (name) => byName.get(name), tables: () => list, broken: () => broken };
}

/**
 * Load the built-in tables, the repository's reference/registry.yaml (when present) and further roots.
 * Every table is checked as it loads; a name defined twice is a problem at the second definition.
 */
export async function loadRegistry(repoRoot: string, extraRoots: readonly RegistryRoot[] = []): Promise<Result<Registry>> {
  const root = resolve(repoRoot);
  const problems: Problem[] = [];
  const list: RefTable[] = [];
  const seen = new Map<string, RefTable>();
  const broken = new Map<string, readonly Problem[]>();
  const add = (tables: readonly RefTable[]): void => {
    for (const t of tables) {
      const first = seen.get(t.name);
      if (first) {
        problems.push({ file: t.origin, ...(t.declaredAt ? { line: t.declaredAt.line, column: t.declaredAt.column } : {}), message: `table "${t.name}" is already defined by ${first.builtIn ? "tablegate (built-in)" : first.origin}` });
        continue;
      }
      seen.set(t.name, t);
      list.push(t);
    }
  };
  const builtIns = await builtInTables();
  if (builtIns.ok) add(builtIns.value);
  else problems.push(...builtIns.problems);

  const manifests: string[] = [];
  const own = join(root, REPO_MANIFEST);
  if (await isFile(own)) manifests.push(own);
  for (const r of extraRoots) {
    const found = await resolveRoot(root, r);
    if (!found.ok) problems.push(...found.problems);
    else if (manifests.includes(found.value)) problems.push({ file: repoLabel(root, found.value), message: "registry listed twice" });
    else manifests.push(found.value);
  }
  for (const m of manifests) {
    const label = repoLabel(root, m);
    const linked = await linkOutReason(root, m);
    if (linked !== undefined) {
      problems.push({ file: label, message: `registry manifest ${linked}` });
      continue;
    }
    const folder = label.slice(0, label.length - "registry.yaml".length);
    const loaded = await loadManifestFile(m, { manifest: label, csv: (f) => `${folder}${f}`, builtIn: false });
    if (!loaded.ok) {
      problems.push(...loaded.problems);
      continue;
    }
    add(loaded.value.tables);
    for (const [name, found] of loaded.value.broken) if (!seen.has(name) && !broken.has(name)) broken.set(name, found);
  }
  return problems.length > 0 ? fail(...problems) : ok(makeRegistry(list, broken));
}
