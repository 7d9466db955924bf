import type { Plan } from "../contract/plan.js";
import type { ColumnSpec } from "../contract/types.js";
import { NO_POOL, type BufferPool } from "../input/buffer-pool.js";
import type { RawRecord } from "../input/types.js";
import { compileType } from "../types/index.js";
import type { Value } from "../values.js";
import { createU32List } from "./growable.js";
import { keyPart } from "./key-text.js";
import { createRowHasher } from "./row-hash.js";
import { createSeenSet, type SeenSet } from "./seen-set.js";
import { trimmed } from "./trim.js";

/**
 * What preparing rows needs, as plain data that can be handed to the parse thread: the declared
 * columns (in contract order), the blank markers, the keys (as column indexes) and whether whole-row
 * duplicates are looked for.
 */
export interface PrepareSpec {
  readonly columns: readonly ColumnSpec[];
  readonly blank: readonly string[];
  readonly keys: readonly (readonly number[])[];
  readonly duplicates: boolean;
  /** The file's size in bytes, to size the key and duplicate tables up front. */
  readonly sizeHint?: number;
}

/** Where each declared column sits in the records (-1 when absent), and how many cells a record must have. */
export interface ColumnLayout {
  readonly positions: Int32Array;
  readonly width: number;
}

/**
 * Rows prepared together. Per row and declared column: a state (PARSED and the rest, with SPACED and
 * ZONED as flags). Per row and column that is not text (see numberSlots): a parsed value as a number.
 * Per row, for each key then for duplicates: -1 when the key has a NULL part, 0 when first seen, else
 * the earlier row it repeats. A record of the wrong width is left at zero throughout; the engine does
 * not look at it.
 */
export interface PreparedRows {
  readonly states: Uint8Array;
  readonly numbers: Float64Array;
  readonly repeats: Int32Array;
}

/** Cell states: parsed, blank, not of its type, column absent. */
export const PARSED = 0;
export const BLANK = 1;
export const INVALID = 2;
export const ABSENT = 3;
/** Flags over a state: the raw cell had spaces that trimming removed; a timestamp carried an offset. */
export const SPACED = 4;
export const ZONED = 8;

/**
 * Where each column's number sits within a row of PreparedRows.numbers (-1 for text, which needs none:
 * it is the cell), and how many numbers a row has.
 */
export function numberSlots(types: readonly ColumnSpec["type"][]): { readonly slots: Int32Array; readonly count: number } {
  let count = 0;
  const slots = Int32Array.from(types, (t) => (t === "text" ? -1 : count++));
  return { slots, count };
}

/** A parsed value as the number PreparedRows holds. */
function numberOf(v: Value): number {
  if (typeof v === "number") return v;
  if (typeof v === "boolean") return v ? 1 : 0;
  if (v === null || typeof v === "string") return 0;
  return v.kind === "date" ? v.days : v.kind === "timestamp" ? v.ms : v.seconds;
}

export interface Preparer {
  /** Prepare the data records records[from, to), which follow those of earlier calls in the file. */
  prepare(records: readonly RawRecord[], from: number, to: number, pool?: BufferPool): PreparedRows;
}

/**
 * The per-row work that needs nothing but the row and the rows before it: trimming, blank markers,
 * parsing each cell by its column's type, and the key and duplicate tables. It runs on the parse
 * thread when there is one, so the checks on the main thread start from prepared rows.
 */
export function createPreparer(spec: PrepareSpec, layout: ColumnLayout): Preparer {
  const n = spec.columns.length;
  const parsers = spec.columns.map((c) => {
    const t = compileType(c);
    return t.ok ? t.parser.parse : () => undefined;
  });
  const blank = new Set(spec.blank);
  // Most cells are longer than any blank marker ("NA", "N/A"), so only short ones meet the set.
  let blankMax = 0;
  for (const b of blank) blankMax = Math.max(blankMax, b.length);
  const { positions, width } = layout;
  const { slots: numberAt, count: perRowNumbers } = numberSlots(spec.columns.map((c) => c.type));
  const keys = spec.keys;
  const nk = keys.length;
  const values: Value[] = new Array<Value>(n).fill(null);
  const texts: string[] = new Array<string>(n).fill("");
  const state = new Uint8Array(n);
  const hasher = createRowHasher();
  // A whole-row duplicate repeats its key too. So with a key, each row's hash waits in a sequential
  // list (8 bytes a row, written in order) and only rows whose first key repeats, or is incomplete,
  // meet the duplicate table: one random memory access a row instead of two.
  const rowHashes = nk > 0 && spec.duplicates ? createU32List(1 << 16) : undefined;
  let keySets: SeenSet[] | undefined;
  let dupSet: SeenSet | undefined;
  let rows = 0;

  // Sized once from the first records and the file's size, so the tables rarely have to grow (each
  // growth re-inserts every entry at random places in memory).
  const sizeTables = (records: readonly RawRecord[], from: number, to: number): void => {
    let chars = 0;
    for (let r = from; r < to; r++) for (const c of (records[r] as RawRecord).cells) chars += c.length + 1;
    const perRow = to > from ? Math.max(1, chars / (to - from)) : 100;
    // A tenth more than the estimate: rows a little shorter than the first ones must not make the table double.
    const expected = spec.sizeHint === undefined ? 0 : Math.min((1.1 * spec.sizeHint) / perRow, 50_000_000);
    const capacity = Math.max(1 << 12, Math.ceil(expected));
    keySets = keys.map(() => createSeenSet(capacity));
    dupSet = spec.duplicates ? createSeenSet(rowHashes ? 1 << 10 : capacity) : undefined;
  };

  const prepareRow = (cells: readonly string[], out: PreparedRows, r: number): void => {
    const rowNo = ++rows;
    if (cells.length !== width) {
      rowHashes?.push(0);
      rowHashes?.push(0);
      return;
    }
    const base = r * n;
    for (let i = 0; i < n; i++) {
      const pos = positions[i] ?? -1;
      if (pos < 0) {
        values[i] = null;
        texts[i] = "";
        state[i] = ABSENT;
        out.states[base + i] = ABSENT;
        continue;
      }
      const raw = cells[pos] ?? "";
      const text = trimmed(raw);
      const spaced = text === raw ? 0 : SPACED;
      if (text === "" || (text.length <= blankMax && blank.has(text))) {
        values[i] = null;
        texts[i] = "";
        state[i] = BLANK;
        out.states[base + i] = BLANK | spaced;
        continue;
      }
      texts[i] = text;
      const v = (parsers[i] as (text: string) => Value | undefined)(text);
      if (v === undefined) {
        values[i] = null;
        state[i] = INVALID;
        out.states[base + i] = INVALID | spaced;
      } else {
        values[i] = v;
        state[i] = PARSED;
        out.states[base + i] = spaced | (typeof v === "object" && v !== null && v.kind === "timestamp" && v.zoned ? ZONED : 0);
        const slot = numberAt[i] as number;
        if (slot >= 0) out.numbers[r * perRowNumbers + slot] = numberOf(v);
      }
    }
    const at = r * (nk + 1);
    let rowHi = 0;
    let rowLo = 0;
    if (dupSet !== undefined) {
      hasher.reset();
      for (let c = 0; c < cells.length; c++) hasher.add(cells[c] as string);
      rowHi = hasher.hi;
      rowLo = hasher.lo;
    }
    // The first key's outcome: 0 unique so far, -1 incomplete, else the row it repeats.
    let firstKey = 0;
    for (let k = 0; k < nk; k++) {
      const columns = keys[k] as readonly number[];
      hasher.reset();
      let complete = true;
      for (const c of columns) {
        // A part that is blank or fails its type is NULL: as SQL UNIQUE, such a key never repeats.
        if (state[c] !== PARSED) complete = false;
        hasher.add(keyPart(values[c] as Value, texts[c] as string, state[c] as number));
      }
      const first = complete ? (keySets as SeenSet[])[k]!.firstOrAdd(hasher.hi, hasher.lo, rowNo) : -1;
      if (k === 0) firstKey = first;
      out.repeats[at + k] = first;
    }
    if (dupSet !== undefined) {
      let first = 0;
      if (rowHashes === undefined || firstKey === -1) first = dupSet.firstOrAdd(rowHi, rowLo, rowNo);
      else if (firstKey > 0) {
        // The row whose key this one repeats joins the table first (a no-op when it already has).
        dupSet.firstOrAdd(rowHashes.at(2 * (firstKey - 1)), rowHashes.at(2 * (firstKey - 1) + 1), firstKey);
        first = dupSet.firstOrAdd(rowHi, rowLo, rowNo);
      }
      rowHashes?.push(rowHi);
      rowHashes?.push(rowLo);
      out.repeats[at + nk] = first;
    }
  };

  return {
    prepare(records, from, to, pool = NO_POOL) {
      if (keySets === undefined) sizeTables(records, from, to);
      const count = Math.max(0, to - from);
      const out: PreparedRows = {
        states: pool.take(Uint8Array, count * n),
        numbers: pool.take(Float64Array, count * perRowNumbers),
        repeats: pool.take(Int32Array, count * (nk + 1)),
      };
      for (let r = 0; r < count; r++) prepareRow((records[from + r] as RawRecord).cells, out, r);
      return out;
    },
  };
}

/** The preparing a plan asks for. */
export function prepareSpecOf(plan: Plan, sizeHint?: number): PrepareSpec {
  return {
    columns: plan.columns.map((c) => c.spec),
    blank: [...plan.input.blank],
    keys: plan.keys.map((k) => k.columns),
    duplicates: plan.duplicates !== undefined,
    ...(sizeHint === undefined ? {} : { sizeHint }),
  };
}
