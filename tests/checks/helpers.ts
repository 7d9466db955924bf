import type { CheckContext, CompiledCheck, Miss, RowView } from "../../src/checks/index.js";
import { CHECKS } from "../../src/checks/index.js";
import type { SpecError } from "../../src/contract/spec-error.js";
import type { ColumnSpec } from "../../src/contract/types.js";
import { compileType } from "../../src/types/index.js";
import type { Value } from "../../src/values.js";

/** A check context with no other columns, no registry tables and today = 2024-06-15 unless overridden. */
export function fakeContext(over: Partial<CheckContext> = {}): CheckContext {
  return {
    column: "c",
    columnIndex: () => undefined,
    columnNames: ["c"],
    sensitive: () => false,
    codeSet: (table) => ({ field: "table", message: `no table ${table}` }),
    today: Date.UTC(2024, 5, 15) / 86_400_000,
    writtenNumber: () => undefined,
    ...over,
  };
}

/** The registered check of this name; fails the test when it is missing. */
function definition(name: string) {
  const def = CHECKS[name];
  if (!def) throw new Error(`no check named ${name}`);
  return def;
}

/** Compile a check that must compile to a test. */
export function compiled(name: string, spec: ColumnSpec, ctx: CheckContext = fakeContext()): CompiledCheck {
  const out = definition(name).compile(spec, ctx);
  if (out === undefined || Array.isArray(out)) throw new Error(`check ${name} did not compile: ${JSON.stringify(out)}`);
  return out;
}

/** Compile a check that must be refused, returning its errors (an empty list when it compiled). */
export function specErrors(name: string, spec: ColumnSpec, ctx: CheckContext = fakeContext()): SpecError[] {
  const out = definition(name).compile(spec, ctx);
  return Array.isArray(out) ? out : [];
}

const NO_ROW: RowView = { values: [], texts: [] };

/**
 * Run a compiled check the way the engine does: parse the trimmed text with the column's own type
 * parser first (a test only ever sees cells that parsed), then call the test.
 */
export function judge(check: CompiledCheck, spec: ColumnSpec, text: string, row: RowView = NO_ROW): Miss | undefined {
  const type = compileType(spec);
  if (!type.ok) throw new Error(`column type did not compile: ${JSON.stringify(type.errors)}`);
  const value: Value | undefined = type.parser.parse(text);
  if (value === undefined || value === null) throw new Error(`${JSON.stringify(text)} does not parse as ${spec.type}`);
  return check.test(value, text, row);
}

/** Compile `name` for `spec` and say, for each text, whether it passes. */
export function passes(name: string, spec: ColumnSpec, text: string, ctx?: CheckContext): boolean {
  return judge(compiled(name, spec, ctx), spec, text) === undefined;
}
