import { readFile } from "node:fs/promises";
import { dirname } from "node:path";
import { fail, ok, type Problem, type Result } from "../problem.js";
import { parseCsvTable } from "./csv-table.js";
import { parseManifest } from "./manifest.js";
import { resolveInside } from "./paths.js";
import type { RefTable } from "./ref-table.js";

/** How to show the files of one registry: labels for the manifest and each CSV, and whether it is built in. */
export interface FolderLabels {
  readonly manifest: string;
  readonly csv: (file: string) => string;
  readonly builtIn: boolean;
}

/** Load one registry.yaml and every table it lists; CSV files must stay inside the manifest's folder. */
export async function loadManifestFile(manifestAbs: string, labels: FolderLabels): Promise<Result<LoadedTables>> {
  let text: string;
  try {
    text = await readFile(manifestAbs, "utf8");
  } catch {
    return fail({ file: labels.manifest, message: "cannot read the registry manifest" });
  }
  const manifest = parseManifest(text, labels.manifest);
  if (!manifest.ok) return manifest;
  const folder = dirname(manifestAbs);
  const broken = new Map<string, Problem[]>();
  const tables: RefTable[] = [];
  for (const entry of manifest.value) {
    const where = { file: labels.manifest, line: entry.at.file.line, column: entry.at.file.column };
    const found = await resolveInside(folder, entry.file);
    if ("escapes" in found) {
      broken.set(entry.name, [{ ...where, message: `table "${entry.name}": file ${entry.file} lies outside the registry folder` }]);
      continue;
    }
    if ("missing" in found) {
      broken.set(entry.name, [{ ...where, message: `table "${entry.name}": file ${entry.file} does not exist` }]);
      continue;
    }
    let bytes: Uint8Array;
    try {
      bytes = await readFile(found.abs);
    } catch {
      broken.set(entry.name, [{ ...where, message: `table "${entry.name}": cannot read ${entry.file}` }]);
      continue;
    }
    const table = parseCsvTable(entry, bytes, { file: labels.csv(entry.file), manifestFile: labels.manifest, builtIn: labels.builtIn });
    if (table.ok) tables.push(table.value);
    else broken.set(entry.name, [...table.problems]);
  }
  return ok({ tables, broken });
}

/** The tables of one manifest that loaded, and the problems of each that did not, by name. */
export interface LoadedTables {
  readonly tables: RefTable[];
  readonly broken: ReadonlyMap<string, readonly Problem[]>;
}
