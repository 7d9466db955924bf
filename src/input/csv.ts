import { Parser, CsvError } from "csv-parse";
import type { Decoder } from "./decode.js";
import { countBreaks, crlfInCells } from "./lines.js";
import { MAX_CELLS, MAX_RECORD_SIZE, type RawRecord, type StructureBreak } from "./types.js";

/** Field separator and quote character of a CSV or TSV file; `quote` null means fields are never quoted. */
export interface CsvDialect {
  readonly delimiter: string;
  readonly quote: string | null;
}

/** A csv-parse parser for the dialect, or the reason the dialect is unusable (e.g. delimiter equals quote). */
export function createCsvParser(dialect: CsvDialect): { parser: Parser } | { error: string } {
  const { delimiter, quote } = dialect;
  if (delimiter === "" || /[\r\n\0]/.test(delimiter)) return { error: `Invalid option delimiter: expected text without line breaks or NUL, got ${JSON.stringify(delimiter)}` };
  if (quote !== null && (quote.length !== 1 || /[\r\n\0]/.test(quote))) return { error: `Invalid option quote: expected one character other than a line break or NUL, got ${JSON.stringify(quote)}` };
  if (quote !== null && delimiter.includes(quote)) return { error: `Invalid option delimiter: expected no quote character in it, got ${JSON.stringify(delimiter)}` };
  try {
    const parser = new Parser({
      delimiter: dialect.delimiter,
      quote: dialect.quote,
      // Doubled quotes inside quoted fields, as RFC 4180 section 2 rule 7.
      escape: dialect.quote,
      // Ragged records are reported by the engine as `row.width`, not refused here.
      relax_column_count: true,
      // An empty physical line is no record (common practice, no source); line numbers still count it.
      skip_empty_lines: true,
      // Every line break ends a record, so mixed line endings cannot glue a CR onto the last cell.
      record_delimiter: ["\r\n", "\n", "\r"],
      // The decoder has removed any byte order mark already.
      bom: false,
    });
    return { parser };
  } catch (e) {
    return { error: e instanceof Error ? e.message : String(e) };
  }
}

/** The live counters csv-parse keeps on its parser. */
interface Counters {
  readonly lines: number;
  readonly empty_lines: number;
  readonly bytes: number;
}

interface Fed {
  readonly buf: Buffer;
  readonly start: number;
}

/**
 * Records of a CSV/TSV byte stream in batches (one per chunk read), each with the physical line where it
 * starts. Drives csv-parse's synchronous state machine chunk by chunk, with no stream in between, so every
 * record completed before a parse error, a bad byte or a read error is delivered; that stop is passed to
 * `stop` with the line where reading stopped.
 */
export async function* readCsv(
  parser: Parser,
  chunks: AsyncIterable<Buffer>,
  decoder: Decoder,
  stop: (b: StructureBreak) => void,
): AsyncGenerator<RawRecord[]> {
  const info = parser.info as Counters;
  let batch: RawRecord[] = [];
  // Where the last record ended: csv-parse's raw line count, our physical line, skipped empty lines, byte offset.
  let rawEnd = 0;
  let lineEnd = 0;
  let emptyEnd = 0;
  let offsetEnd = 0;
  // Bytes fed since the last record ended, to place a stop that falls inside a record.
  let fed: Fed[] = [];
  let fedBytes = 0;
  let parseError: unknown;
  let wideAt = 0;

  // csv-parse hands each finished record to `push` synchronously, with its counters current.
  parser.push = (record: unknown): boolean => {
    // Past a stop, csv-parse still finishes the chunk it was given; what follows the stop is not read.
    if (record === null || parseError !== undefined) return false;
    const cells = record as string[];
    const skipped = info.empty_lines - emptyEnd;
    const line = lineEnd + 1 + skipped;
    if (cells.length > MAX_CELLS) {
      parseError = TOO_WIDE;
      wideAt = line;
      return false;
    }
    const span = info.lines - rawEnd - skipped;
    // csv-parse counts a CR LF inside quotes as two lines; correct for it only on multi-line records.
    lineEnd = span > 1 ? line + span - 1 - crlfInCells(cells) : line;
    rawEnd = info.lines;
    emptyEnd = info.empty_lines;
    offsetEnd = info.bytes;
    batch.push({ cells, line });
    return true;
  };
  const done = (err?: Error | null): void => {
    if (err) parseError = err;
  };
  const feed = (data: Buffer): boolean => {
    if (data.length === 0) return true;
    fed.push({ buf: data, start: fedBytes });
    fedBytes += data.length;
    parser._transform(data, "utf8", done);
    while (fed.length > 1 && fed[1]!.start <= offsetEnd) fed.shift();
    // Checked here rather than by csv-parse's max_record_size, which costs a test on every byte.
    if (parseError === undefined && fedBytes - offsetEnd > MAX_RECORD_SIZE) parseError = TOO_LONG;
    return parseError === undefined;
  };
  const lineReached = (): number => {
    let breaks = 0;
    for (const f of fed) {
      const from = Math.max(0, offsetEnd - f.start);
      if (from < f.buf.length) breaks += countBreaks(f.buf, from, f.buf.length, from > 0 && f.buf[from - 1] === 0x0d);
    }
    return lineEnd + 1 + breaks;
  };
  // csv-parse holds back the last few bytes of a chunk to see whether a line break or quote continues;
  // when reading stops mid-file, these bytes (no delimiter, quote or line break) let it finish what came
  // before. Whatever they start is never flushed, and an error they cause is not the file's.
  const settle = (): void => {
    if (parseError === undefined) parser._transform(SETTLE, "utf8", () => undefined);
  };
  const take = (): RawRecord[] => {
    const out = batch;
    batch = [];
    return out;
  };

  try {
    for await (const chunk of chunks) {
      const d = decoder.decode(chunk);
      const ok = feed(d.data);
      if (batch.length > 0) yield take();
      if (!ok) return stop(parseBreak(parseError, parseError === TOO_WIDE ? wideAt : lineEnd + 1 + info.empty_lines - emptyEnd));
      if (d.invalid !== undefined) {
        settle();
        if (batch.length > 0) yield take();
        return stop({ line: lineReached(), message: `found ${d.invalid}` });
      }
    }
  } catch (e) {
    settle();
    if (batch.length > 0) yield take();
    return stop({ line: lineReached(), message: `the file could not be read further: ${readError(e)}` });
  }
  const last = decoder.end();
  const ok = feed(last.data);
  if (ok && last.invalid !== undefined) {
    settle();
    if (batch.length > 0) yield take();
    return stop({ line: lineReached(), message: `found ${last.invalid}` });
  }
  if (ok) parser._flush(done);
  if (batch.length > 0) yield take();
  if (parseError !== undefined) stop(parseBreak(parseError, parseError === TOO_WIDE ? wideAt : lineEnd + 1 + info.empty_lines - emptyEnd));
}

const SETTLE = Buffer.alloc(8);

/** A csv-parse error as a break at the line where the failing record starts. */
/** The stop for a record past MAX_RECORD_SIZE bytes. */
const TOO_LONG = new Error("record too long");
/** The stop for a record of more than MAX_CELLS cells. */
const TOO_WIDE = new Error("record too wide");

function parseBreak(err: unknown, line: number): StructureBreak {
  if (err === TOO_WIDE) return { line, message: `the record starting at line ${line} has more than ${MAX_CELLS.toLocaleString("en-US")} cells` };
  if (err === TOO_LONG) return { line, message: `the record starting at line ${line} is longer than ${MAX_RECORD_SIZE / 1024 / 1024} MiB (a quote that never closes?)` };
  const field = err instanceof CsvError && typeof err.column === "number" ? { column: err.column + 1 } : {};
  const code = err instanceof CsvError ? err.code : undefined;
  const place = `${field.column === undefined ? "" : `field ${field.column} of `}the record starting at line ${line}`;
  switch (code) {
    case "CSV_QUOTE_NOT_CLOSED":
      return { line, message: `unterminated quoted field in the record starting at line ${line}` };
    case "CSV_INVALID_CLOSING_QUOTE":
      return { line, ...field, message: `a closing quote is followed by text in ${place}` };
    case "INVALID_OPENING_QUOTE":
      return { line, ...field, message: field.column === undefined ? `a quote inside an unquoted field in ${place}` : `a quote inside unquoted ${place}` };
    default:
      return { line, ...field, message: `${place} cannot be parsed: ${err instanceof Error ? err.message : String(err)}` };
  }
}

/** The reason a read or decompression failed, without a stack. */
export function readError(e: unknown): string {
  if (e instanceof Error) {
    const code = (e as { code?: unknown }).code;
    return typeof code === "string" ? `${e.message} (${code})` : e.message;
  }
  return String(e);
}
