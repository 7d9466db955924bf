/**
 * Whether String.prototype.trim could remove this UTF-16 unit: its white space and line terminators
 * (ECMA-262 §22.1.3.32: Zs, tab, VT, FF, U+FEFF, LF, CR, U+2028, U+2029). Most cells start and end
 * with neither, and this test is cheaper than trimming them.
 */
function mayTrim(c: number): boolean {
  return c <= 32 || c === 160 || (c >= 0x1680 && (c === 0x1680 || (c >= 0x2000 && c <= 0x200a) || c === 0x2028 || c === 0x2029 || c === 0x202f || c === 0x205f || c === 0x3000 || c === 0xfeff));
}

/** A raw cell without the spaces `trim` removes; the same string when it has none. Checks and repairs both trim by it. */
export function trimmed(raw: string): string {
  return raw.length > 0 && (mayTrim(raw.charCodeAt(0)) || mayTrim(raw.charCodeAt(raw.length - 1))) ? raw.trim() : raw;
}
