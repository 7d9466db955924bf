import type { ColumnSpec } from "../contract/types.js";

/** A decimal number exactly as written: sign, significant digits and a power of ten. */
interface Exact {
  readonly negative: boolean;
  readonly digits: bigint;
  readonly exponent: number;
}

/** Read a cell or bound as an exact decimal, honouring the column's thousands, decimal mark and percent. */
function exactOf(text: string, spec: ColumnSpec): Exact | undefined {
  let t = text.trim();
  let exponent = 0;
  if (spec.percent && t.endsWith("%")) {
    t = t.slice(0, -1).trimEnd();
    exponent -= 2;
  }
  const mark = spec.decimal_mark ?? ".";
  if (spec.thousands !== undefined) t = t.split(spec.thousands).join("");
  if (spec.thousands === " ") t = t.replace(/[\u00a0\u202f]/g, "");
  const negative = t.startsWith("-");
  if (negative || t.startsWith("+")) t = t.slice(1);
  // Exponent notation only where the contract writes a number (1e21, 1.5e-21); cells never use it.
  const e = spec.type === "decimal" && spec.decimal_mark === undefined && spec.thousands === undefined ? t.search(/[eE]/) : -1;
  if (e >= 0) {
    const power = Number(t.slice(e + 1));
    if (!Number.isInteger(power)) return undefined;
    exponent += power;
    t = t.slice(0, e);
  }
  const at = t.indexOf(mark);
  const whole = at < 0 ? t : t.slice(0, at);
  const frac = at < 0 ? "" : t.slice(at + 1);
  if (!/^\d*$/.test(whole) || !/^\d*$/.test(frac) || whole + frac === "") return undefined;
  return { negative, digits: BigInt(whole + frac), exponent: exponent - frac.length };
}

function compareExact(a: Exact, b: Exact): number {
  const sa = a.digits === 0n ? 0 : a.negative ? -1 : 1;
  const sb = b.digits === 0n ? 0 : b.negative ? -1 : 1;
  if (sa !== sb) return sa - sb;
  const e = Math.min(a.exponent, b.exponent);
  const x = a.digits * 10n ** BigInt(a.exponent - e);
  const y = b.digits * 10n ** BigInt(b.exponent - e);
  const c = x === y ? 0 : x > y ? 1 : -1;
  return sa < 0 ? -c : c;
}

/**
 * Settle a tie between two numbers that compared equal as doubles: the cell as written against the
 * bound as the contract wrote it. Rounding to a double never reverses an order, so only ties need this.
 */
export function compareWritten(text: string, bound: string, spec: ColumnSpec): number {
  const a = exactOf(text, spec);
  const b = exactOf(bound, { type: "decimal" });
  return a && b ? compareExact(a, b) : 0;
}
