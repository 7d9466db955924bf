import type { ColumnSpec } from "../contract/types.js";
import { timeValue, type TimeValue } from "../values.js";
import { firstOf, formatEntries, joinOr } from "./format-list.js";
import { parseIsoTime } from "./iso.js";
import type { CompiledType } from "./parser.js";
import { compileStrftime } from "./strftime.js";

type Parse = (text: string) => TimeValue | undefined;

const parseDefault: Parse = (text) => {
  const seconds = parseIsoTime(text);
  return seconds === undefined ? undefined : timeValue(seconds);
};

/**
 * Compile a time-of-day column: by default hh:mm or hh:mm:ss (00:00 to 23:59:59; no 24:00, no leap
 * second); `format` may list strftime patterns built from %H %M %S.
 */
export function compileTime(spec: ColumnSpec): CompiledType {
  const { entries, errors } = formatEntries(spec.format, undefined);
  if (entries.length === 0 && errors.length === 0) {
    return { ok: true, parser: { parse: parseDefault, expected: "a time as HH:MM or HH:MM:SS" } };
  }
  const parsers: Parse[] = [];
  for (const { format, path } of entries) {
    const compiled = compileStrftime(format, "time");
    if (compiled.ok) parsers.push(compiled.parse as Parse);
    else errors.push({ path, message: compiled.message, ...(compiled.offset === undefined ? {} : { offset: compiled.offset }) });
  }
  if (errors.length > 0) return { ok: false, errors };
  return { ok: true, parser: { parse: firstOf(parsers), expected: `a time as ${joinOr(entries.map((e) => e.format))}` } };
}
