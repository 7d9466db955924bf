import type { ColumnSpec } from "../contract/types.js";
import { timestampValue, type TimestampValue } from "../values.js";
import { firstOf, formatEntries, joinOr } from "./format-list.js";
import { parseIsoTimestamp } from "./iso.js";
import type { CompiledType } from "./parser.js";
import { parseSerialTimestamp, type SerialSystem } from "./serial-date.js";
import { compileStrftime } from "./strftime.js";

/** The format name for ISO 8601 / RFC 3339 text, the default when a column names no format. */
export const ISO_TIMESTAMP_FORMAT = "iso-8601";

type Parse = (text: string) => TimestampValue | undefined;

/**
 * Compile a timestamp column. Formats: iso-8601 (the default), strftime patterns with the date
 * directives plus %H %M %S %z, and serial-1900 / serial-1904 (fraction = time of day). `timezone:
 * required` rejects values without an offset, `forbidden` values with one. Unzoned values are read as UTC.
 */
export function compileTimestamp(spec: ColumnSpec): CompiledType {
  const { entries, errors } = formatEntries(spec.format, ISO_TIMESTAMP_FORMAT);
  const policy = spec.timezone ?? "optional";
  const parsers: Parse[] = [];
  for (const { format, path } of entries) {
    if (format === ISO_TIMESTAMP_FORMAT) {
      parsers.push(parseIsoTimestamp);
    } else if (format === "serial-1900" || format === "serial-1904") {
      if (policy === "required") errors.push({ path, message: `${format} carries no UTC offset, but timezone is required` });
      const system: SerialSystem = format;
      parsers.push((text) => {
        const ms = parseSerialTimestamp(text, system);
        return ms === undefined ? undefined : timestampValue(ms, false);
      });
    } else {
      const compiled = compileStrftime(format, "timestamp", [ISO_TIMESTAMP_FORMAT, "serial-1900", "serial-1904"]);
      if (!compiled.ok) {
        errors.push({ path, message: compiled.message, ...(compiled.offset === undefined ? {} : { offset: compiled.offset }) });
        continue;
      }
      if (policy === "required" && !compiled.zoned) errors.push({ path, message: "the pattern has no %z, but timezone is required" });
      if (policy === "forbidden" && compiled.zoned) errors.push({ path, message: "the pattern has %z, but timezone is forbidden" });
      parsers.push(compiled.parse as Parse);
    }
  }
  if (errors.length > 0) return { ok: false, errors };
  const any = firstOf(parsers);
  const parse: Parse =
    policy === "optional"
      ? any
      : (text) => {
          const v = any(text);
          return v !== undefined && v.zoned === (policy === "required") ? v : undefined;
        };
  const formats = entries.map((e) => (e.format === ISO_TIMESTAMP_FORMAT ? "ISO 8601" : e.format));
  const zone = policy === "required" ? " with a UTC offset" : policy === "forbidden" ? " without a UTC offset" : "";
  return { ok: true, parser: { parse, expected: `a timestamp as ${joinOr(formats)}${zone}` } };
}

