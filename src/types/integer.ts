import type { ColumnSpec } from "../contract/types.js";
import type { CompiledType } from "./parser.js";
import { checkThousands, groupCodes, parseNumberText, type NumberSyntax } from "./number-text.js";

/**
 * Compile an integer column: optional sign (+ or -, as SQL numeric literals allow), digits, and
 * correctly grouped thousands when `thousands` is declared. Values beyond ±2^53-1 are type errors
 * because a JavaScript number could not hold them exactly.
 */
export function compileInteger(spec: ColumnSpec): CompiledType {
  const errors = checkThousands(spec.thousands, undefined);
  if (errors.length > 0) return { ok: false, errors };
  const syntax: NumberSyntax = { group: groupCodes(spec.thousands), mark: -1, percent: false };
  const parse = (text: string): number | undefined => {
    const n = parseNumberText(text, syntax);
    return n !== undefined && Math.abs(n) <= Number.MAX_SAFE_INTEGER ? n : undefined;
  };
  const expected = spec.thousands === undefined ? "an integer" : `an integer with "${spec.thousands}" as thousands separator`;
  return { ok: true, parser: { parse, expected } };
}
