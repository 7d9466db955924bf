import type { SpecError } from "../contract/spec-error.js";

/** How a column writes numbers: which characters group thousands, which marks decimals, whether % may follow. */
export interface NumberSyntax {
  /** Char codes accepted as the thousands separator; empty when grouping is not declared. */
  readonly group: readonly number[];
  /** Char code of the decimal mark; -1 for integers. */
  readonly mark: number;
  /** A trailing % (optionally after one space) divides the number by 100. */
  readonly percent: boolean;
}

const DOT = 46;
const PERCENT = 37;
// A space-grouped number is written with a plain, no-break or narrow no-break space depending on
// the producing software (common practice, no source); accept all three when the contract says " ".
const SPACES = [0x20, 0xa0, 0x202f] as const;

/** The char codes a declared `thousands` option accepts. */
export function groupCodes(thousands: string | undefined): readonly number[] {
  if (thousands === undefined) return [];
  if (thousands === " ") return SPACES;
  return [thousands.charCodeAt(0)];
}

/** Check a `thousands` option: one character that cannot be part of a number otherwise. */
export function checkThousands(thousands: unknown, markChar: string | undefined): SpecError[] {
  if (thousands === undefined) return [];
  if (typeof thousands !== "string" || thousands.length !== 1 || /[0-9+\-%eE]/.test(thousands)) {
    return [{ path: ["thousands"], message: 'thousands must be one character such as ",", ".", " " or "\'"' }];
  }
  if (markChar !== undefined && thousands === markChar) {
    return [{ path: ["thousands"], message: `thousands and decimal_mark are both "${markChar}"` }];
  }
  return [];
}

const isSpace = (c: number): boolean => c === 0x20 || c === 0xa0 || c === 0x202f;

/**
 * Parse a plain number: optional sign, digits (grouped correctly when a separator is used), an
 * optional decimal part, an optional %. No exponent, NaN or Infinity. Undefined when not a number.
 */
export function parseNumberText(text: string, syntax: NumberSyntax): number | undefined {
  const len = text.length;
  let end = len;
  let percent = false;
  if (syntax.percent && len > 1 && text.charCodeAt(len - 1) === PERCENT) {
    percent = true;
    end = isSpace(text.charCodeAt(len - 2)) ? len - 2 : len - 1;
  }
  const group = syntax.group;
  let i = 0;
  const first = text.charCodeAt(0);
  if (first === 43 || first === 45) i = 1;
  let intDigits = 0;
  let groupLen = 0;
  let grouped = false;
  while (i < end) {
    const c = text.charCodeAt(i);
    if (c >= 48 && c <= 57) {
      intDigits++;
      groupLen++;
    } else if (group.length > 0 && group.includes(c)) {
      // first group 1-3 digits, every later group exactly 3: 1,234,567 yes, 12,34 no
      if (groupLen === 0 || (grouped ? groupLen !== 3 : groupLen > 3)) return undefined;
      grouped = true;
      groupLen = 0;
    } else break;
    i++;
  }
  if (grouped && groupLen !== 3) return undefined;
  let fracDigits = 0;
  if (i < end && text.charCodeAt(i) === syntax.mark) {
    i++;
    while (i < end) {
      const c = text.charCodeAt(i);
      if (c < 48 || c > 57) break;
      fracDigits++;
      i++;
    }
  }
  if (i !== end || intDigits + fracDigits === 0) return undefined;
  let source: string;
  if (!grouped && (syntax.mark === DOT || syntax.mark === -1)) {
    source = end === len ? text : text.slice(0, end);
  } else {
    // Rebuild in JavaScript's own syntax so Number() rounds the decimal text once, correctly.
    source = "";
    for (let k = 0; k < end; k++) {
      const c = text.charCodeAt(k);
      if (c === syntax.mark) source += ".";
      else if (!group.includes(c)) source += text[k];
    }
  }
  // Shifting the exponent keeps 15% exactly as close to 0.15 as Number("0.15") is.
  const n = Number(percent ? source + "e-2" : source);
  if (!Number.isFinite(n)) return undefined;
  return n === 0 ? 0 : n;
}
