import type { PreparedRows } from "../engine/prepare.js";
import { NO_POOL, type BufferPool } from "./buffer-pool.js";
import { ownString } from "./own-string.js";
import type { RawRecord } from "./types.js";

/**
 * Records laid end to end for passing from the parse thread to the main one: every cell's text in
 * one string, and a layout of numbers (per record: its cell count, its line, then each cell's length).
 * One string and one transferable array cross the thread boundary, instead of an object per record
 * and a string per cell.
 */
export interface PackedRecords {
  readonly text: string;
  readonly layout: Uint32Array;
  /** The records' prepared rows, in order, when they were prepared before packing. */
  readonly prepared?: PreparedRows;
}

/**
 * Pack records from `from` on until their text reaches `budget` characters (at least one record);
 * returns the packed records and the index after the last one packed. Appending builds a rope,
 * flattened once when the message is sent.
 */
export function packRecords(records: readonly RawRecord[], from = 0, budget = Infinity, pool: BufferPool = NO_POOL): { packed: PackedRecords; next: number } {
  let end = from;
  let size = 0;
  let chars = 0;
  while (end < records.length && (end === from || chars < budget)) {
    const cells = (records[end] as RawRecord).cells;
    size += 2 + cells.length;
    for (let c = 0; c < cells.length; c++) chars += (cells[c] as string).length;
    end++;
  }
  const layout = pool.take(Uint32Array, size);
  let text = "";
  let at = 0;
  for (let r = from; r < end; r++) {
    const { cells, line } = records[r] as RawRecord;
    layout[at++] = cells.length;
    layout[at++] = line;
    for (let c = 0; c < cells.length; c++) {
      const cell = cells[c] as string;
      layout[at++] = cell.length;
      text += cell;
    }
  }
  return { packed: { text, layout }, next: end };
}

/** A cell of the batch's text that does not keep the whole batch alive (see own-string.ts). */
function cut(text: string, from: number, to: number): string {
  return ownString(text.slice(from, to));
}

/** The buffers under a packed piece's typed arrays, to be handed back once its rows are checked. */
export function buffersOf(packed: PackedRecords): ArrayBuffer[] {
  const p = packed.prepared;
  const arrays = p === undefined ? [packed.layout] : [packed.layout, p.states, p.numbers, p.repeats];
  return arrays.map((a) => a.buffer as ArrayBuffer);
}

/** The records of a packed batch, as they were before packing. */
export function unpackRecords(packed: PackedRecords): RawRecord[] {
  const { text, layout, prepared } = packed;
  const out: RawRecord[] = [];
  let pos = 0;
  let at = 0;
  while (at < layout.length) {
    const n = layout[at++] as number;
    const line = layout[at++] as number;
    const cells = new Array<string>(n);
    for (let c = 0; c < n; c++) {
      const len = layout[at++] as number;
      cells[c] = cut(text, pos, pos + len);
      pos += len;
    }
    out.push(prepared === undefined ? { cells, line } : { cells, line, prepared, at: out.length });
  }
  return out;
}
