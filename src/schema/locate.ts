import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";

// Schemas live in src/schema and ship with the package; both src/ (tests) and dist/ (the built tool)
// sit two levels below the package root, so one relative URL serves both.
const here = (name: string): URL => new URL(`../../src/schema/${name}`, import.meta.url);

/** Absolute path of a schema shipped with tablegate, e.g. "contract.schema.json". */
export function schemaPath(name: string): string {
  return fileURLToPath(here(name));
}

/** A shipped schema, parsed. */
export function readSchema(name: string): Record<string, unknown> {
  return JSON.parse(readFileSync(here(name), "utf8")) as Record<string, unknown>;
}
