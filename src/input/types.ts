import type { ColumnLayout, PreparedRows } from "../engine/prepare.js";
/** The text encodings a contract may declare; `auto` sniffs a byte order mark, else UTF-8, else windows-1252. */
export type Encoding = "utf-8" | "utf-16le" | "utf-16be" | "windows-1252" | "latin1" | "auto";

/** How to read one delivery file, taken from the contract's `input` section. */
export interface InputOptions {
  readonly format: "csv" | "tsv" | "ndjson";
  /** Field separator; default `,` for csv and a tab for tsv. */
  readonly delimiter?: string;
  /** Quote character; default `"` for csv, none for tsv. */
  readonly quote?: string;
  readonly encoding: Encoding;
}

/**
 * The longest record a delivery may hold, in characters (16 Mi, as text after decoding): far
 * beyond any real row, and a stop for a quote that never closes (which would otherwise swallow the rest
 * of the file into one cell) before it exhausts memory.
 */
export const MAX_RECORD_SIZE = 16 * 1024 * 1024;

/** The most cells a record may have: far past any spreadsheet's columns (16,384), and a bound on the memory one record takes. */
export const MAX_CELLS = 100_000;

/**
 * One record as read: its cells untouched (no trimming) and the 1-based physical line where it starts.
 * A record from the parse thread comes prepared: row `at` of `prepared` holds its parsed cells.
 */
export interface RawRecord {
  readonly cells: readonly string[];
  readonly line: number;
  readonly prepared?: PreparedRows;
  readonly at?: number;
}

/** Why reading stopped before the end of the file; `column` is the 1-based field number when known. */
export interface StructureBreak {
  readonly line: number;
  readonly column?: number;
  readonly message: string;
}

/** What is known about the file once its records have been read. */
export interface DeliverySummary {
  /** The encoding actually used (`auto` resolved). */
  readonly encoding: string;
  /** Set when `auto` found no byte order mark and bytes that are not UTF-8, and fell back to windows-1252. */
  readonly note?: string;
  /** Size of the file on disk (compressed size for `.gz`). */
  readonly bytes: number;
  /** SHA-256 of the file on disk, lowercase hex. */
  readonly sha256: string;
}

/** An opened delivery: records in file order (header first, if any), in batches, then a summary. */
export interface Delivery {
  /** Batches of records in file order; ends early after a structure break. Iterate once. */
  readonly records: AsyncIterable<readonly RawRecord[]>;
  /** After iteration: why reading stopped early, if it did. */
  structureBreak(): StructureBreak | undefined;
  /** Where the declared columns are, once the header is read: a delivery that prepares rows needs it. */
  columnsFound?(columns: ColumnLayout): void;
  /** After iteration: encoding used, fallback note, raw size and hash. */
  summary(): DeliverySummary;
  /** Raw bytes read from the file so far (compressed bytes for `.gz`), for progress. */
  bytesRead(): number;
}
