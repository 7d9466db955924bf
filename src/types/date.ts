import type { ColumnSpec } from "../contract/types.js";
import { dateValue, type DateValue } from "../values.js";
import { firstOf, formatEntries, joinOr } from "./format-list.js";
import type { CompiledType } from "./parser.js";
import { parseSerialDate, type SerialSystem } from "./serial-date.js";
import { compileStrftime } from "./strftime.js";

/** The date format used when a column names none. */
export const DEFAULT_DATE_FORMAT = "%Y-%m-%d";

/** Compile a date column: each `format` is a strftime pattern or serial-1900 / serial-1904, tried in order. */
export function compileDate(spec: ColumnSpec): CompiledType {
  const { entries, errors } = formatEntries(spec.format, DEFAULT_DATE_FORMAT);
  const parsers: ((text: string) => DateValue | undefined)[] = [];
  for (const { format, path } of entries) {
    if (format === "serial-1900" || format === "serial-1904") {
      const system: SerialSystem = format;
      parsers.push((text) => {
        const days = parseSerialDate(text, system);
        return days === undefined ? undefined : dateValue(days);
      });
      continue;
    }
    // A pattern with no % at all is a name, and the only names are the two serial systems.
    if (!format.includes("%")) {
      errors.push({ path, message: `unknown date format ${JSON.stringify(format)}; expected a strftime pattern such as "%Y-%m-%d", or serial-1900 or serial-1904` });
      continue;
    }
    const compiled = compileStrftime(format, "date", ["serial-1900", "serial-1904"]);
    if (compiled.ok) {
      parsers.push(compiled.parse as (text: string) => DateValue | undefined);
    } else errors.push({ path, message: compiled.message, ...(compiled.offset === undefined ? {} : { offset: compiled.offset }) });
  }
  if (errors.length > 0) return { ok: false, errors };
  return { ok: true, parser: { parse: firstOf(parsers), expected: `a date as ${joinOr(entries.map((e) => e.format))}` } };
}
