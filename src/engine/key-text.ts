import type { Value } from "../values.js";

/** An integer's digits as written, without grouping, a plus sign or leading zeros. */
function bigDigits(text: string): string {
  const digits = text.replace(/[^0-9]/g, "").replace(/^0+(?=\d)/, "");
  return text.trimStart().startsWith("-") ? `-${digits}` : digits;
}

/** A key part as keys compare it: typed values by what they mean (`01` = `1`, `1.50` = `1.5`), text as written. */
export function keyText(v: Value, text: string): string {
  if (typeof v === "string") return text;
  // Beyond 2^53 two integers can share a double; their digits as written (sign, no zeros in front) still differ.
  if (typeof v === "number" && Number.isInteger(v) && !Number.isSafeInteger(v) && !/[.eE]/.test(text)) return `n${bigDigits(text)}`;
  if (typeof v === "number" || typeof v === "boolean") return String(v);
  if (v === null) return "";
  return v.kind === "date" ? `d${v.days}` : v.kind === "timestamp" ? `t${v.ms}` : `s${v.seconds}`;
}

/**
 * One part of a key or group key from a cell in its state (0 parsed, 1 blank, 2 not of its type,
 * 3 absent): a parsed value as keyText gives it, anything else "" — NULL, as a cell that fails its
 * type is everywhere else (SQL GROUP BY puts NULLs in one group; a key with a NULL part is never compared).
 */
export function keyPart(v: Value, text: string, state: number): string {
  return state === 0 ? keyText(v, text) : "";
}

/** Parts joined so that no two different lists join alike: each part preceded by its length. */
export function joinParts(parts: readonly string[]): string {
  let out = "";
  for (const p of parts) out += `${p.length}:${p}`;
  return out;
}

/** The parts `joinParts` joined. */
export function splitParts(joined: string): string[] {
  const parts: string[] = [];
  for (let at = 0; at < joined.length; ) {
    const colon = joined.indexOf(":", at);
    const len = Number(joined.slice(at, colon));
    parts.push(joined.slice(colon + 1, colon + 1 + len));
    at = colon + 1 + len;
  }
  return parts;
}
