import { DATE_FORMATS, VALUE_CANDIDATES } from "./candidates.js";
import type { ColumnSummary } from "./column-observer.js";

/** What a column was judged to be: a VALUE_CANDIDATES entry, dates in some formats, or text. */
export type TypeChoice =
  | { readonly kind: "value"; readonly index: number }
  | { readonly kind: "date"; readonly formats: readonly string[]; readonly alsoReads: readonly string[] }
  | { readonly kind: "text" };

const TIMESTAMP = VALUE_CANDIDATES.findIndex((c) => c.spec.type === "timestamp");

/**
 * The first type that reads every value: numbers, then booleans, then dates, then timestamps and
 * times, else text. A column named like a date tries dates first, so `20241107` in `ship_date` is a date.
 */
export function chooseType(s: ColumnSummary, dateNamed: boolean): TypeChoice {
  if (s.values === 0) return { kind: "text" };
  const dates = s.datesFit ? dateFormats(s.dateMasks) : undefined;
  if (dateNamed && dates) return dates;
  for (let i = 0; i < TIMESTAMP; i++) if (s.fits[i]) return { kind: "value", index: i };
  if (dates) return dates;
  for (let i = TIMESTAMP; i < VALUE_CANDIDATES.length; i++) if (s.fits[i]) return { kind: "value", index: i };
  return { kind: "text" };
}

/**
 * The formats to list: each value's first fitting format, in DATE_FORMATS order. That is also the
 * format the check will read it with (it tries formats in order), so no value changes meaning.
 * Formats that also read every value of some chosen one are returned apart, for a comment.
 */
function dateFormats(masks: ReadonlySet<number>): TypeChoice & { kind: "date" } {
  let chosen = 0;
  for (const m of masks) chosen |= m & -m;
  let also = 0;
  for (let f = 0; f < DATE_FORMATS.length; f++) {
    const bit = 1 << f;
    if (chosen & bit) continue;
    // f reads every value that some chosen format g reads first
    for (let g = 0; g < DATE_FORMATS.length; g++) {
      const gb = 1 << g;
      if (!(chosen & gb)) continue;
      const firsts = [...masks].filter((m) => (m & -m) === gb);
      if (firsts.length > 0 && firsts.every((m) => (m & bit) !== 0)) also |= bit;
    }
  }
  const pick = (bits: number) => DATE_FORMATS.filter((_f, i) => (bits & (1 << i)) !== 0);
  return { kind: "date", formats: pick(chosen), alsoReads: pick(also) };
}
