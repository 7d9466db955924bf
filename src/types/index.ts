import type { ColumnSpec } from "../contract/types.js";
import type { Value } from "../values.js";
import { compileBoolean } from "./boolean.js";
import { compileDate } from "./date.js";
import { compileDecimal } from "./decimal.js";
import { compileInteger } from "./integer.js";
import type { CompiledType } from "./parser.js";
import { textParser } from "./text.js";
import { compileTime } from "./time.js";
import { compileTimestamp } from "./timestamp.js";

export type { CompiledType, TypeParser } from "./parser.js";
export { parseBound } from "./bound.js";
export { compareValues } from "./compare.js";
export { formatValue } from "./format-value.js";
export { todayDays } from "./calendar.js";
export { decimalScale } from "./decimal.js";

/**
 * Build the parser for a column once. Errors point below the column node, e.g. ['format', 1] for
 * the second of its formats, or ['thousands'].
 */
export function compileType(spec: ColumnSpec): CompiledType {
  const compiled = compileBare(spec);
  if (!compiled.ok || spec.type === "text") return compiled;
  return { ok: true, parser: { ...compiled.parser, parse: rememberLast(compiled.parser.parse) } };
}

/**
 * Deliveries repeat themselves from row to row (the same date, the same discount), so a column's
 * parser hands back its previous answer for the same text: no parsing, and no new value object.
 * Values are immutable, so sharing one is safe.
 */
function rememberLast(parse: (text: string) => Value | undefined): (text: string) => Value | undefined {
  let lastText: string | undefined;
  let lastValue: Value | undefined;
  return (text) => {
    if (text === lastText) return lastValue;
    lastValue = parse(text);
    lastText = text;
    return lastValue;
  };
}

function compileBare(spec: ColumnSpec): CompiledType {
  switch (spec.type) {
    case "text":
      return { ok: true, parser: textParser };
    case "integer":
      return compileInteger(spec);
    case "decimal":
      return compileDecimal(spec);
    case "boolean":
      return compileBoolean(spec);
    case "date":
      return compileDate(spec);
    case "timestamp":
      return compileTimestamp(spec);
    case "time":
      return compileTime(spec);
    default:
      // the contract schema admits only the types above; this guards hand-built specs
      return { ok: false, errors: [{ path: ["type"], message: `unknown column type ${String((spec as { type: unknown }).type)}` }] };
  }
}
