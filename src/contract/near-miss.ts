/**
 * Edit distance with a swap of two neighbouring characters counted as one edit ("flase" is one
 * typo from "false"), the optimal-string-alignment variant of Damerau–Levenshtein; small inputs only.
 */
export function editDistance(a: string, b: string): number {
  if (a === b) return 0;
  let before: number[] = [];
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const cur = [i];
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let d = Math.min((prev[j] ?? 0) + 1, (cur[j - 1] ?? 0) + 1, (prev[j - 1] ?? 0) + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) d = Math.min(d, (before[j - 2] ?? 0) + 1);
      cur.push(d);
    }
    before = prev;
    prev = cur;
  }
  return prev[b.length] ?? 0;
}

const fold = (s: string): string => s.trim().toLowerCase().replace(/[\s_-]+/g, "_");

/** Names longer than this are matched only when equal after folding: edit distance costs length squared. */
const MAX_EDITED = 64;

/**
 * The candidate closest to `name`, if close enough to be a likely typo: equal after folding case,
 * spaces, dashes and underscores, or within a third of its length in edits.
 */
export function nearMiss(name: string, candidates: Iterable<string>): string | undefined {
  return nearMissAmong(candidates)(name);
}

/** `nearMiss` against one list of candidates, folded once, for asking about many names. */
export function nearMissAmong(candidates: Iterable<string>): (name: string) => string | undefined {
  const list = [...candidates].map((c) => ({ c, f: fold(c) }));
  return (name) => {
    const folded = fold(name);
    const limit = Math.max(1, Math.floor(name.length / 3));
    let best: string | undefined;
    let bestScore = Infinity;
    for (const { c, f } of list) {
      if (f === folded) return c;
      // Lengths further apart than the limit are at least that many edits apart.
      if (Math.abs(f.length - folded.length) > limit || folded.length > MAX_EDITED || f.length > MAX_EDITED) continue;
      const score = editDistance(folded, f);
      if (score < bestScore) [best, bestScore] = [c, score];
    }
    return bestScore <= limit ? best : undefined;
  };
}

/** ` (did you mean "x"?)` or nothing. */
export function suggestion(name: string, candidates: Iterable<string>): string {
  return said(nearMiss(name, candidates));
}

/** ` (did you mean "x"?)` for a hit, nothing for none. */
export function said(hit: string | undefined): string {
  return hit === undefined ? "" : ` (did you mean "${hit}"?)`;
}
