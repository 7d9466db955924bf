/**
 * SQL LIKE (ISO/IEC 9075 <like predicate>): `%` matches any run of characters, `_` exactly one
 * character (a code point), everything else itself, case-sensitively. Matched by a two-pointer
 * wildcard scan in O(text × pattern) at worst, never by a backtracking regex.
 */

const ANY_RUN = -1;
const ANY_ONE = -2;

/** A compiled LIKE pattern, or the index (in code units of the pattern) of a bad escape. */
export function compileLike(pattern: string, escape: string | null): { ok: true; test: (text: string) => boolean } | { ok: false; index: number; message: string } {
  const parts: number[] = [];
  let plain = true;
  for (let i = 0; i < pattern.length; ) {
    const cp = pattern.codePointAt(i) as number;
    const width = cp > 0xffff ? 2 : 1;
    if (escape !== null && pattern.startsWith(escape, i)) {
      const after = pattern.codePointAt(i + escape.length);
      const escaped = after === undefined ? "" : String.fromCodePoint(after);
      if (escaped !== "%" && escaped !== "_" && escaped !== escape) {
        return { ok: false, index: i, message: `the escape character must be followed by %, _ or itself, found ${after === undefined ? "the end of the pattern" : JSON.stringify(escaped)}` };
      }
      parts.push(after as number);
      i += escape.length + escaped.length;
      continue;
    }
    if (cp === 37) {
      if (parts[parts.length - 1] !== ANY_RUN) parts.push(ANY_RUN);
      plain = false;
    } else if (cp === 95) {
      parts.push(ANY_ONE);
      plain = false;
    } else parts.push(cp);
    i += width;
  }
  return { ok: true, test: fastPath(parts, plain) ?? ((text) => matchParts(parts, text)) };
}

function literalOf(parts: readonly number[]): string | null {
  let s = "";
  for (const p of parts) {
    if (p < 0) return null;
    s += String.fromCodePoint(p);
  }
  return s;
}

/** `abc`, `abc%`, `%abc` and `%abc%` need no scan. */
function fastPath(parts: readonly number[], plain: boolean): ((text: string) => boolean) | null {
  if (plain) {
    const lit = literalOf(parts) as string;
    return (text) => text === lit;
  }
  const first = parts[0] === ANY_RUN;
  const last = parts.length > 1 && parts[parts.length - 1] === ANY_RUN;
  const inner = literalOf(parts.slice(first ? 1 : 0, last ? -1 : undefined));
  if (inner === null) return null;
  if (first && last) return (text) => text.includes(inner);
  if (first) return (text) => text.endsWith(inner);
  if (last) return (text) => text.startsWith(inner);
  return null;
}

function matchParts(parts: readonly number[], text: string): boolean {
  let t = 0;
  let p = 0;
  let starP = -1;
  let starT = 0;
  while (t < text.length) {
    const part = parts[p];
    if (part === ANY_RUN) {
      starP = p++;
      starT = t;
      continue;
    }
    const cp = text.codePointAt(t) as number;
    const width = cp > 0xffff ? 2 : 1;
    if (part !== undefined && (part === ANY_ONE || part === cp)) {
      p++;
      t += width;
      continue;
    }
    if (starP < 0) return false;
    // Let the last % swallow one more character and retry from there.
    p = starP + 1;
    const sc = text.codePointAt(starT) as number;
    starT += sc > 0xffff ? 2 : 1;
    t = starT;
  }
  while (parts[p] === ANY_RUN) p++;
  return p === parts.length;
}
