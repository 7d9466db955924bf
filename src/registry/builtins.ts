import { fileURLToPath } from "node:url";
import type { Result } from "../problem.js";
import { fail, ok } from "../problem.js";
import { iso3166Table } from "./iso-3166-1.js";
import { loadManifestFile } from "./manifest-folder.js";
import type { RefTable } from "./ref-table.js";

/** Names of the tables that ship with tablegate. */
export const BUILT_IN_NAMES: readonly string[] = ["iso-3166-1", "us-states", "ca-provinces"];

let cached: Promise<Result<RefTable[]>> | undefined;

/** The built-in tables, loaded once per process from the package's own reference/builtin folder. */
export function builtInTables(): Promise<Result<RefTable[]>> {
  cached ??= load();
  return cached;
}

async function load(): Promise<Result<RefTable[]>> {
  // Same relative hop from src/registry and from dist/registry; the package ships reference/.
  const manifest = fileURLToPath(new URL("../../reference/builtin/registry.yaml", import.meta.url));
  const shipped = await loadManifestFile(manifest, { manifest: "(built-in)/registry.yaml", csv: (f) => `(built-in)/${f}`, builtIn: true });
  if (!shipped.ok) return shipped;
  // A built-in table that does not load is tablegate's own fault: nothing can be checked.
  const broken = [...shipped.value.broken.values()].flat();
  if (broken.length > 0) return fail(...broken);
  return ok([iso3166Table(), ...shipped.value.tables]);
}
