import { compareValues } from "../types/index.js";
import type { Value } from "../values.js";
import { DATE_FORMATS, VALUE_CANDIDATES } from "./candidates.js";
import type { ColumnSummary } from "./column-observer.js";

/** What a column was judged to be: a VALUE_CANDIDATES entry, dates in some formats, or text. */
export type TypeChoice =
  | { readonly kind: "value"; readonly index: number }
  | { readonly kind: "date"; readonly formats: readonly string[]; readonly alsoReads: readonly string[]; readonly low: Value; readonly high: Value }
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
 * The fewest formats that read every value (ties: earlier formats in DATE_FORMATS), listed in that
 * order. The check reads a value with the first listed format that fits, so the observed range is
 * taken per value set from that format. Formats left out that also read every value are returned
 * apart, for a comment (01/02/2026 fits month/day and day/month alike).
 */
function dateFormats(masks: ReadonlyMap<number, readonly Value[]>): TypeChoice & { kind: "date" } {
  const all = 1 << DATE_FORMATS.length;
  let best = -1;
  for (let set = 1; set < all; set++) {
    let covers = true;
    for (const m of masks.keys()) if ((m & set) === 0) covers = false;
    if (covers && (best < 0 || bits(set) < bits(best) || (bits(set) === bits(best) && earlier(set, best)))) best = set;
  }
  let low: Value = null;
  let high: Value = null;
  let shared = all - 1;
  for (const [m, range] of masks) {
    shared &= m;
    const f = Math.log2((m & best) & -(m & best));
    const lo = range[2 * f] as Value;
    const hi = range[2 * f + 1] as Value;
    if (low === null || (lo !== null && compareValues(lo, low) < 0)) low = lo;
    if (high === null || (hi !== null && compareValues(hi, high) > 0)) high = hi;
  }
  const pick = (set: number) => DATE_FORMATS.filter((_f, i) => (set & (1 << i)) !== 0);
  return { kind: "date", formats: pick(best), alsoReads: best === (best & -best) ? pick(shared & ~best) : [], low, high };
}

function bits(n: number): number {
  let c = 0;
  for (; n !== 0; n &= n - 1) c++;
  return c;
}

/** Whether set `a` lists earlier formats than `b` (compared from the first format on). */
function earlier(a: number, b: number): boolean {
  for (let f = 0; f < DATE_FORMATS.length; f++) {
    const inA = (a >> f) & 1;
    const inB = (b >> f) & 1;
    if (inA !== inB) return inA === 1;
  }
  return false;
}
