/**
 * Refuses regular expressions whose shape invites catastrophic backtracking in a backtracking engine
 * such as V8's: a repeated group that itself contains a repetition, as in `(a+)+`, `(\d*)*` or
 * `(x+y?){2,}`. This is a syntactic screen: it also refuses some harmless shapes such as `(\w+\.)+`,
 * and it does not catch overlapping alternatives like `(a|a)*`.
 */

/** Offset (in the pattern) and message of the first nested quantifier, or null when none is found. */
export function findNestedQuantifier(pattern: string): { index: number; message: string } | null {
  // Per open group: does it contain a quantifier that repeats (max > 1)?
  const stack: { start: number; end: number; repeats: boolean }[] = [{ start: -1, end: -1, repeats: false }];
  let lastGroup: { start: number; end: number; repeats: boolean } | null = null;
  for (let i = 0; i < pattern.length; i++) {
    const c = pattern[i];
    if (c === "\\") {
      i++;
      lastGroup = null;
      continue;
    }
    if (c === "[") {
      for (i++; i < pattern.length && pattern[i] !== "]"; i++) if (pattern[i] === "\\") i++;
      lastGroup = null;
      continue;
    }
    if (c === "(") {
      stack.push({ start: i, end: i, repeats: false });
      lastGroup = null;
      continue;
    }
    if (c === ")") {
      const closed = stack.length > 1 ? (stack.pop() as { start: number; end: number; repeats: boolean }) : null;
      if (closed !== null) closed.end = i + 1;
      if (closed !== null && closed.repeats) (stack[stack.length - 1] as { repeats: boolean }).repeats = true;
      lastGroup = closed;
      continue;
    }
    const q = quantifierAt(pattern, i);
    if (q !== null) {
      const top = stack[stack.length - 1] as { repeats: boolean };
      if (q.max > 1) {
        if (lastGroup !== null && lastGroup.repeats) {
          return {
            index: i,
            message: `nested quantifier: '${pattern.slice(i, q.end)}' repeats the group ${pattern.slice(lastGroup.start, lastGroup.end)}, which itself repeats; matching can take exponential time, so write the pattern without the outer repetition`,
          };
        }
        top.repeats = true;
      }
      i = q.end - 1;
      if (pattern[q.end] === "?") i++;
      lastGroup = null;
      continue;
    }
    lastGroup = null;
  }
  return null;
}

function quantifierAt(pattern: string, i: number): { max: number; end: number } | null {
  const c = pattern[i];
  if (c === "*" || c === "+") return { max: Infinity, end: i + 1 };
  if (c === "?") return { max: 1, end: i + 1 };
  if (c !== "{") return null;
  const m = /^\{(\d+)(,(\d*))?\}/.exec(pattern.slice(i));
  if (m === null) return null;
  const max = m[2] === undefined ? Number(m[1]) : m[3] === "" || m[3] === undefined ? Infinity : Number(m[3]);
  return { max, end: i + m[0].length };
}
