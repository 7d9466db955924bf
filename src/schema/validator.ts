import { existsSync } from "node:fs";
import { createRequire } from "node:module";
import { fileURLToPath } from "node:url";
import type { ErrorObject } from "ajv";
import { readSchema } from "./locate.js";

const require = createRequire(import.meta.url);

/** The shipped schemas that user files are validated against. */
export type SchemaName = "contract" | "registry" | "project";

const OPTIONS = { strict: true, allowUnionTypes: true } as const;

/**
 * A validator for one shipped schema. `valid` is the fast path taken on every run: the standalone
 * code ajv generated at build time (`npm run build` writes dist/schema/<name>.validate.cjs), so a run
 * neither loads ajv nor compiles a schema. `errors` builds the full validator (all errors, verbose)
 * only when a file is invalid, to say everything that is wrong and where. Without the built file
 * (tests run from src/) both paths compile with ajv.
 */
export interface SchemaValidator {
  valid(data: unknown): boolean;
  errors(data: unknown): readonly ErrorObject[];
}

type Check = ((data: unknown) => boolean) & { errors?: ErrorObject[] | null };

const cache = new Map<SchemaName, SchemaValidator>();

function compile(name: SchemaName, extra: Record<string, unknown>): Check {
  const { Ajv2020 } = require("ajv/dist/2020.js") as typeof import("ajv/dist/2020.js");
  return new Ajv2020({ ...OPTIONS, ...extra }).compile(readSchema(`${name}.schema.json`)) as Check;
}

export function schemaValidator(name: SchemaName): SchemaValidator {
  const known = cache.get(name);
  if (known) return known;
  const built = fileURLToPath(new URL(`./${name}.validate.cjs`, import.meta.url));
  let fast: Check | undefined = existsSync(built) ? (require(built) as { default: Check }).default : undefined;
  let full: Check | undefined;
  const v: SchemaValidator = {
    valid(data) {
      fast ??= compile(name, {});
      return fast(data);
    },
    errors(data) {
      full ??= compile(name, { allErrors: true, verbose: true });
      return full(data) ? [] : (full.errors ?? []);
    },
  };
  cache.set(name, v);
  return v;
}

/** Build step: write the standalone validators beside this module (dist/schema). */
export function writeStandaloneValidators(write: (file: string, code: string) => void): void {
  const { Ajv2020 } = require("ajv/dist/2020.js") as typeof import("ajv/dist/2020.js");
  const standalone = (require("ajv/dist/standalone/index.js") as { default: (ajv: unknown, fn: unknown) => string }).default;
  for (const name of ["contract", "registry", "project"] as const) {
    const ajv = new Ajv2020({ ...OPTIONS, code: { source: true } });
    const fn = ajv.compile(readSchema(`${name}.schema.json`));
    write(fileURLToPath(new URL(`./${name}.validate.cjs`, import.meta.url)), standalone(ajv, fn));
  }
}
