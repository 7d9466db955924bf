import { compareValues, decimalScale } from "../types/index.js";
import type { Value } from "../values.js";
import { DATE_PARSERS, NUMBER_CANDIDATES, SERIAL_FORMAT, VALUE_CANDIDATES } from "./candidates.js";
import { isEmail } from "./email.js";
import { BLANK_MARKERS, markerIndex } from "./markers.js";
import { createShapeTracker, type ShapeTracker } from "./shape.js";

/** Distinct values kept per column; past this a column is not a code list. */
export const DISTINCT_CAP = 50;

/** What one column's cells showed, with bounded memory whatever the row count. */
export interface ColumnSummary {
  readonly name: string;
  /** Cells seen (records of the header's width). */
  readonly cells: number;
  /** Cells empty after trimming. */
  readonly empty: number;
  /** Count of cells equal (after trimming) to each of BLANK_MARKERS. */
  readonly markers: readonly number[];
  /** Cells with leading or trailing spaces. */
  readonly padded: number;
  /** Cells neither empty nor a marker. */
  readonly values: number;
  /** Per VALUE_CANDIDATES entry: whether every value parsed. */
  readonly fits: readonly boolean[];
  /** Per VALUE_CANDIDATES entry: the smallest and largest value it read (while it fitted). */
  readonly low: readonly Value[];
  readonly high: readonly Value[];
  /** Per VALUE_CANDIDATES entry: fewest and most digits after the decimal mark (decimals only). */
  readonly scaleLow: readonly number[];
  readonly scaleHigh: readonly number[];
  /** Every value read as a date by some format of DATE_FORMATS. */
  readonly datesFit: boolean;
  /**
   * Each distinct set of DATE_FORMATS (as bits) that read some value together, with the smallest and
   * largest date each of those formats read from such values (index 2f and 2f+1; null elsewhere).
   */
  readonly dateMasks: ReadonlyMap<number, readonly Value[]>;
  /** Distinct trimmed values, complete unless `distinctOverflow`. */
  readonly distinct: ReadonlySet<string>;
  readonly distinctOverflow: boolean;
  readonly minLength: number;
  readonly maxLength: number;
  readonly shape: ShapeTracker;
  /** Every value passes `format: email`. */
  readonly emails: boolean;
}

/** Feeds one column's raw cells and summarises them; `serialDates` admits spreadsheet day numbers as dates. */
export interface ColumnObserver {
  observe(raw: string): void;
  summary(): ColumnSummary;
}

/** A fresh observer for the column `name`. */
export function createColumnObserver(name: string, serialDates: boolean): ColumnObserver {
  const n = VALUE_CANDIDATES.length;
  const fits = new Array<boolean>(n).fill(true);
  const low = new Array<Value>(n).fill(null);
  const high = new Array<Value>(n).fill(null);
  const scaleLow = new Array<number>(n).fill(Infinity);
  const scaleHigh = new Array<number>(n).fill(0);
  const markers = new Array<number>(BLANK_MARKERS.length).fill(0);
  const distinct = new Set<string>();
  const shape = createShapeTracker();
  const dateMasks = new Map<number, Value[]>();
  let cells = 0;
  let empty = 0;
  let padded = 0;
  let values = 0;
  let distinctOverflow = false;
  let minLength = Infinity;
  let maxLength = 0;
  let emails = true;
  let datesFit = true;
  const dateValues = new Array<Value>(DATE_PARSERS.length).fill(null);

  const widen = (i: number, v: Value): void => {
    const lo = low[i] as Value;
    if (lo === null || compareValues(v, lo) < 0) low[i] = v;
    const hi = high[i] as Value;
    if (hi === null || compareValues(v, hi) > 0) high[i] = v;
  };

  const observe = (raw: string): void => {
    cells++;
    const text = raw.trim();
    if (text !== raw) padded++;
    if (text === "") {
      empty++;
      return;
    }
    const m = markerIndex(text);
    if (m >= 0) {
      markers[m] = (markers[m] as number) + 1;
      return;
    }
    values++;
    if (!distinctOverflow) {
      // a value seen before changes nothing below: most cells of a column with few values stop here
      if (distinct.has(text)) return;
      distinct.add(text);
      if (distinct.size > DISTINCT_CAP) {
        distinctOverflow = true;
        distinct.clear();
      }
    }
    if (text.length < minLength) minLength = text.length;
    if (text.length > maxLength) maxLength = text.length;
    shape.add(text);
    if (emails && !isEmail(text)) emails = false;
    // A leading zero (`08123`) or more digits than a double holds exactly (card and account numbers)
    // marks an identifier, not a quantity: no number type may claim it.
    if (identifierDigits(text)) for (const i of NUMBER_CANDIDATES) fits[i] = false;
    for (let i = 0; i < n; i++) {
      if (!fits[i]) continue;
      const c = VALUE_CANDIDATES[i] as (typeof VALUE_CANDIDATES)[number];
      const v = c.parser.parse(text);
      if (v === undefined) {
        fits[i] = false;
        continue;
      }
      widen(i, v);
      if (c.spec.type === "decimal") {
        const s = decimalScale(text, c.spec);
        if (s < (scaleLow[i] as number)) scaleLow[i] = s;
        if (s > (scaleHigh[i] as number)) scaleHigh[i] = s;
      }
    }
    if (datesFit) {
      let mask = 0;
      for (let f = 0; f < DATE_PARSERS.length; f++) {
        const v = f === SERIAL_FORMAT && !serialDates ? undefined : (DATE_PARSERS[f] as (typeof DATE_PARSERS)[number]).parse(text);
        dateValues[f] = v ?? null;
        if (v !== undefined) mask |= 1 << f;
      }
      if (mask === 0) {
        datesFit = false;
        dateMasks.clear();
      } else {
        let range = dateMasks.get(mask);
        if (range === undefined) dateMasks.set(mask, (range = new Array<Value>(2 * DATE_PARSERS.length).fill(null)));
        for (let f = 0; f < DATE_PARSERS.length; f++) {
          const v = dateValues[f] as Value;
          if (v === null) continue;
          const lo = range[2 * f] as Value;
          const hi = range[2 * f + 1] as Value;
          if (lo === null || compareValues(v, lo) < 0) range[2 * f] = v;
          if (hi === null || compareValues(v, hi) > 0) range[2 * f + 1] = v;
        }
      }
    }
  };

  return {
    observe,
    summary: () => ({
      name, cells, empty, markers, padded, values, fits, low, high, scaleLow, scaleHigh, datesFit, dateMasks,
      distinct, distinctOverflow, minLength: values === 0 ? 0 : minLength, maxLength, shape, emails: emails && values > 0,
    }),
  };
}

/** Digits only, and either a leading zero before another digit or more than 15 of them. */
function identifierDigits(text: string): boolean {
  if (text.length < 2) return false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 48 || c > 57) return text.charCodeAt(0) === 48 && i > 1;
  }
  return text.charCodeAt(0) === 48 || text.length > 15;
}
