/** Rows up to which the first column, and the first two together, are checked for uniqueness. */
export const KEY_ROW_CAP = 1_000_000;
/** Rows up to which every other column is checked (they are only mentioned, never proposed). */
export const OTHER_KEY_ROW_CAP = 20_000;

/** How a candidate key fared: unique in every row, repeated (or blank) somewhere, or unique up to its cap. */
export type KeyOutcome = "unique" | "repeats" | "capped";

/** A candidate key: column indexes, and how it fared. */
export interface KeyCandidate {
  readonly columns: readonly number[];
  readonly outcome: KeyOutcome;
}

/**
 * Turns a column's trimmed text into what the key check compares (typed values by meaning, `01` = `1`),
 * or undefined when the cell would be blank. Known only once the column types are decided.
 */
export type KeyText = (column: number, text: string) => string | undefined;

/** Watches rows for key candidates: the first column, the first two together, and each other column. */
export interface KeyTracker {
  /** One record of the header's width. */
  observe(cells: readonly string[]): void;
  /** Outcomes, re-checked with the final column types: the first column, then the pair, then the rest. */
  result(keyText: KeyText): KeyCandidate[];
}

interface Live {
  readonly columns: readonly number[];
  readonly cap: number;
  seen: Set<string> | undefined;
  outcome: KeyOutcome;
}

/**
 * A tracker for records of `width` cells. Memory: one string per row and live candidate, up to the
 * caps (KEY_ROW_CAP for the first column and pair, OTHER_KEY_ROW_CAP for the rest unless given).
 */
export function createKeyTracker(width: number, caps: { readonly first: number; readonly other: number } = { first: KEY_ROW_CAP, other: OTHER_KEY_ROW_CAP }): KeyTracker {
  const live: Live[] = [];
  if (width >= 1) live.push({ columns: [0], cap: caps.first, seen: new Set(), outcome: "unique" });
  if (width >= 2) live.push({ columns: [0, 1], cap: caps.first, seen: new Set(), outcome: "unique" });
  for (let c = 1; c < width; c++) live.push({ columns: [c], cap: caps.other, seen: new Set(), outcome: "unique" });
  let rows = 0;

  return {
    observe(cells) {
      rows++;
      for (const k of live) {
        const seen = k.seen;
        if (seen === undefined) continue;
        if (rows > k.cap) {
          k.outcome = "capped";
          k.seen = undefined;
          continue;
        }
        const key = joinKey(k.columns.map((c) => (cells[c] ?? "").trim()));
        if (key === undefined || seen.has(key)) {
          k.outcome = "repeats";
          k.seen = undefined;
          continue;
        }
        seen.add(key);
      }
    },
    result(keyText) {
      return live.map((k) => ({ columns: k.columns, outcome: k.outcome === "unique" && k.seen !== undefined ? recheck(k.columns, k.seen, keyText) : k.outcome }));
    },
  };
}

/** Parts joined so that no two different part lists give the same string; undefined if a part is empty. */
function joinKey(parts: readonly string[]): string | undefined {
  if (parts.length === 1) return parts[0] === "" ? undefined : parts[0];
  let out = "";
  for (const p of parts) {
    if (p === "") return undefined;
    out += `${p.length}:${p}`;
  }
  return out;
}

function splitKey(key: string, n: number): string[] {
  if (n === 1) return [key];
  const parts: string[] = [];
  let at = 0;
  while (at < key.length) {
    const colon = key.indexOf(":", at);
    const len = Number(key.slice(at, colon));
    parts.push(key.slice(colon + 1, colon + 1 + len));
    at = colon + 1 + len;
  }
  return parts;
}

/** Unique by text is not enough when the check compares typed values: `1.50` repeats `1.5`. */
function recheck(columns: readonly number[], seen: ReadonlySet<string>, keyText: KeyText): KeyOutcome {
  const typed = new Set<string>();
  for (const key of seen) {
    const parts = splitKey(key, columns.length);
    const texts: string[] = [];
    for (let i = 0; i < columns.length; i++) {
      const t = keyText(columns[i] as number, parts[i] as string);
      // a blank part: the check skips this row's key, and the draft will not propose a column with blanks
      if (t === undefined) return "repeats";
      texts.push(t);
    }
    const joined = joinKey(texts) ?? "";
    if (typed.has(joined)) return "repeats";
    typed.add(joined);
  }
  return "unique";
}
