import { expect } from "vitest";
import type { ColumnSpec } from "../../src/contract/types.js";
import { compileType, type TypeParser } from "../../src/types/index.js";
import type { SpecError } from "../../src/contract/spec-error.js";

/** Compile a column spec that must compile. */
export function parserFor(spec: ColumnSpec): TypeParser {
  const r = compileType(spec);
  if (!r.ok) throw new Error(`unexpected compile errors: ${JSON.stringify(r.errors)}`);
  return r.parser;
}

/** Compile a column spec that must fail, returning its errors. */
export function errorsFor(spec: ColumnSpec): SpecError[] {
  const r = compileType(spec);
  expect(r.ok).toBe(false);
  return r.ok ? [] : r.errors;
}

/** Day number of a date computed by JavaScript's Date.UTC (the general-purpose reference); years >= 100. */
export function utcDays(year: number, month: number, day: number): number {
  return Date.UTC(year, month - 1, day) / 86_400_000;
}
