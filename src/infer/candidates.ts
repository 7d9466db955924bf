import type { ColumnSpec } from "../contract/types.js";
import { compileType, type TypeParser } from "../types/index.js";

/** A column type a draft may propose: the spec it would write, and that spec's own parser. */
export interface Candidate {
  readonly spec: ColumnSpec;
  readonly parser: TypeParser;
}

function candidate(spec: ColumnSpec): Candidate {
  const compiled = compileType(spec);
  // The specs below are fixed and valid; a failure here is a bug in this list, not in user input.
  if (!compiled.ok) throw new Error(`infer: candidate ${JSON.stringify(spec)} does not compile`);
  return { spec, parser: compiled.parser };
}

/**
 * Non-date candidates in the order a column is tried against them: an integer column of 0 and 1 stays
 * integer, a boolean needs words; thousands separators and decimal commas only when plain forms fail.
 */
export const VALUE_CANDIDATES: readonly Candidate[] = [
  candidate({ type: "integer" }),
  candidate({ type: "boolean" }),
  candidate({ type: "integer", thousands: "," }),
  candidate({ type: "decimal" }),
  candidate({ type: "decimal", thousands: "," }),
  candidate({ type: "decimal", decimal_mark: "," }),
  candidate({ type: "decimal", decimal_mark: ",", thousands: "." }),
  candidate({ type: "decimal", percent: true }),
  candidate({ type: "timestamp" }),
  candidate({ type: "time" }),
];

/** Indexes into VALUE_CANDIDATES of the number types, which a value with a leading zero rules out. */
export const NUMBER_CANDIDATES: readonly number[] = VALUE_CANDIDATES.flatMap((c, i) => (c.spec.type === "integer" || c.spec.type === "decimal" ? [i] : []));

/** Date formats tried, in the order a draft lists them; `serial-1900` only for columns named like dates. */
export const DATE_FORMATS: readonly string[] = ["%Y-%m-%d", "%m/%d/%Y", "%d/%m/%Y", "%d.%m.%Y", "%Y%m%d", "serial-1900"];

/** Index of `serial-1900` in DATE_FORMATS. */
export const SERIAL_FORMAT = DATE_FORMATS.indexOf("serial-1900");

/** One parser per entry of DATE_FORMATS. */
export const DATE_PARSERS: readonly TypeParser[] = DATE_FORMATS.map((f) => candidate({ type: "date", format: f }).parser);
