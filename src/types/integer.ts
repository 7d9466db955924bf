import type { ColumnSpec } from "../contract/types.js";
import type { CompiledType } from "./parser.js";
import { checkThousands, groupCodes, parseNumberText, type NumberSyntax } from "./number-text.js";

/**
 * Compile an integer column: optional sign (+ or -, as SQL numeric literals allow), digits, and
 * correctly grouped thousands when `thousands` is declared. Any number of digits is an integer;
 * beyond ±2^53-1 the value is held as the nearest double, and `min`/`max` settle ties on the digits
 * as written, so bounds stay exact.
 */
export function compileInteger(spec: ColumnSpec): CompiledType {
  const errors = checkThousands(spec.thousands, undefined);
  if (errors.length > 0) return { ok: false, errors };
  const syntax: NumberSyntax = { group: groupCodes(spec.thousands), mark: -1, percent: false };
  const parse = (text: string): number | undefined => {
    const n = parseNumberText(text, syntax);
    return n !== undefined && Number.isFinite(n) ? n : undefined;
  };
  const expected = spec.thousands === undefined ? "an integer" : `an integer with "${spec.thousands}" as thousands separator`;
  return { ok: true, parser: { parse, expected } };
}
