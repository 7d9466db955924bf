import type { SpecError } from "../contract/spec-error.js";
import type { ColumnSpec } from "../contract/types.js";
import type { CompiledType } from "./parser.js";
import { checkThousands, groupCodes, parseNumberText, type NumberSyntax } from "./number-text.js";

/**
 * Compile a decimal column: optional sign, digits, an optional decimal part written with
 * `decimal_mark` (".5" and "5." are accepted, as in SQL numeric literals), correctly grouped
 * thousands when declared, and with `percent: true` an optional trailing % (15% = 0.15).
 */
export function compileDecimal(spec: ColumnSpec): CompiledType {
  const errors: SpecError[] = [];
  const mark = spec.decimal_mark ?? ".";
  if (mark !== "." && mark !== ",") errors.push({ path: ["decimal_mark"], message: 'decimal_mark must be "." or ","' });
  errors.push(...checkThousands(spec.thousands, mark));
  if (errors.length > 0) return { ok: false, errors };
  const syntax: NumberSyntax = { group: groupCodes(spec.thousands), mark: mark.charCodeAt(0), percent: spec.percent === true };
  const parse = (text: string): number | undefined => parseNumberText(text, syntax);
  const notes: string[] = [];
  if (mark !== ".") notes.push(`"${mark}" as decimal mark`);
  if (spec.thousands !== undefined) notes.push(`"${spec.thousands}" as thousands separator`);
  let expected = notes.length > 0 ? `a decimal with ${notes.join(" and ")}` : "a decimal";
  if (syntax.percent) expected += ", optionally followed by %";
  return { ok: true, parser: { parse, expected } };
}

/**
 * Digits after the decimal mark as written (the `scale` check): '12.50' is 2, '12' is 0,
 * '12.5%' is 1 (the text, not the divided value). Call it on text the decimal parser accepted.
 */
export function decimalScale(text: string, spec: ColumnSpec): number {
  const at = text.lastIndexOf(spec.decimal_mark ?? ".");
  if (at < 0) return 0;
  let n = 0;
  for (let i = at + 1; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 48 || c > 57) break;
    n++;
  }
  return n;
}
