import { StringDecoder } from "node:string_decoder";
import { Parser, CsvError } from "csv-parse";
import type { Decoder } from "./decode.js";
import { breaksIn } from "./lines.js";
import { ownString } from "./own-string.js";
import { INSIDE_QUOTES, recordEnd } from "./quoted-record.js";
import { MAX_CELLS, MAX_RECORD_SIZE, type RawRecord, type StructureBreak } from "./types.js";

/** Field separator and quote character of a CSV or TSV file; `quote` null means fields are never quoted. */
export interface CsvDialect {
  readonly delimiter: string;
  readonly quote: string | null;
}

/** csv-parse's state machine under its stream: parses `buf`, handing each record to `push`; returns its error. */
interface CsvParseMachine {
  parse(buf: Buffer, end: boolean, push: (record: unknown) => void, close: () => void): Error | undefined;
}

/** What reads one file of a dialect: the dialect itself, and csv-parse for its records that hold quotes. */
export interface CsvReader {
  readonly dialect: CsvDialect;
  readonly machine: CsvParseMachine;
}

/** A reader for the dialect, or the reason the dialect is unusable (e.g. delimiter equals quote). */
export function createCsvReader(dialect: CsvDialect): { reader: CsvReader } | { error: string } {
  const { delimiter, quote } = dialect;
  if (delimiter === "" || /[\r\n\0]/.test(delimiter)) return { error: `Invalid option delimiter: expected text without line breaks or NUL, got ${JSON.stringify(delimiter)}` };
  if (quote !== null && (quote.length !== 1 || /[\r\n\0]/.test(quote))) return { error: `Invalid option quote: expected one character other than a line break or NUL, got ${JSON.stringify(quote)}` };
  if (quote !== null && delimiter.includes(quote)) return { error: `Invalid option delimiter: expected no quote character in it, got ${JSON.stringify(delimiter)}` };
  try {
    const parser = new Parser({
      delimiter,
      quote,
      // Doubled quotes inside quoted fields, as RFC 4180 section 2 rule 7.
      escape: quote,
      // Ragged records are reported by the engine as `row.width`, not refused here.
      relax_column_count: true,
      // An empty physical line is no record (common practice, no source); line numbers still count it.
      skip_empty_lines: true,
      // Every line break ends a record, so mixed line endings cannot glue a CR onto the last cell.
      record_delimiter: ["\r\n", "\n", "\r"],
      // The decoder has removed any byte order mark already.
      bom: false,
    });
    return { reader: { dialect, machine: (parser as unknown as { api: CsvParseMachine }).api } };
  } catch (e) {
    return { error: e instanceof Error ? e.message : String(e) };
  }
}

/** How much text follows what a scan is given: more to come, none (the file ended), or none (reading stopped). */
type Follows = "more" | "end" | "stop";

const LF = 0x0a;
const CR = 0x0d;

/**
 * Bytes decoded into one string at a time. V8 puts a string past about 128 KB in its large-object space,
 * where each allocation costs as much as decoding a megabyte (measured: 124 MB took 0.7 s in 256 KB
 * strings, 0.02 s in 64 KB ones).
 */
export const TEXT_PIECE = 64 * 1024;

/** Past this many characters, an unfinished record is held as pieces (see `add`). */
const LONG_RECORD = 1024 * 1024;
const ignore = (): void => undefined;

/**
 * Records of a CSV/TSV byte stream in batches (one per TEXT_PIECE decoded), each with the physical line where it
 * starts. A record whose line holds no quote character is that line cut at the delimiter, which is all
 * RFC 4180 allows there; consecutive records that hold quotes go to csv-parse as one piece of text, read
 * whole, so it never holds bytes back between pieces. Every record completed before a parse error, a bad
 * byte or a read error is delivered; that stop is passed to `stop` with the line where reading stopped.
 */
export async function* readCsv(reader: CsvReader, chunks: AsyncIterable<Buffer>, decoder: Decoder, stop: (b: StructureBreak) => void): AsyncGenerator<RawRecord[]> {
  const { delimiter, quote } = reader.dialect;
  const utf8 = new StringDecoder("utf8");
  let batch: RawRecord[] = [];
  // Text not yet made into records; it starts a record, on physical line `line`.
  let pending = "";
  let line = 1;
  let broken: StructureBreak | undefined;
  // The run of quoted records waiting for csv-parse: where it starts in the text scanned, each one's line.
  let runFrom = -1;
  const runLines: number[] = [];

  const readRun = (text: string, to: number): void => {
    let k = 0;
    const err = reader.machine.parse(
      Buffer.from(text.slice(runFrom, to), "utf8"),
      true,
      (record) => {
        if (broken !== undefined) return;
        const cells = record as string[];
        const at = runLines[k++] ?? line;
        if (cells.length > MAX_CELLS) broken = tooWide(at);
        else batch.push({ cells, line: at });
      },
      ignore,
    );
    if (err !== undefined && broken === undefined) broken = parseBreak(err, runLines[k] ?? line);
    runFrom = -1;
    runLines.length = 0;
  };

  // Makes records of what is complete in `pending` and keeps the rest. Positions of the next LF, CR and
  // quote are found once and reused until passed, so each character is looked at about once.
  const scan = (follows: Follows): void => {
    const text = pending;
    const len = text.length;
    let pos = 0;
    let lf = text.indexOf("\n");
    let cr = text.indexOf("\r");
    let qt = quote === null ? -1 : text.indexOf(quote);
    while (pos < len && broken === undefined) {
      if (lf >= 0 && lf < pos) lf = text.indexOf("\n", pos);
      if (cr >= 0 && cr < pos) cr = text.indexOf("\r", pos);
      if (qt >= 0 && qt < pos) qt = text.indexOf(quote as string, pos);
      let end = lf < 0 ? cr : cr < 0 ? lf : Math.min(lf, cr);
      const quoted = qt >= 0 && (end < 0 || qt < end);
      if (quoted) end = Math.max(-1, recordEnd(text, qt + 1, true, quote));
      let next: number;
      if (end < 0) {
        if (follows !== "end") break;
        end = next = len;
      } else if (text.charCodeAt(end) === CR) {
        // A CR at the end of the text may be the first half of a CR LF.
        if (end + 1 === len && follows === "more") break;
        next = text.charCodeAt(end + 1) === LF ? end + 2 : end + 1;
      } else next = end + 1;
      if (quoted) {
        if (runFrom < 0) runFrom = pos;
        runLines.push(line);
        line += breaksIn(text, pos, next);
      } else {
        if (runFrom >= 0) readRun(text, pos);
        // An empty line is no record (csv-parse's skip_empty_lines, above).
        if (end > pos && broken === undefined) {
          const cells = text.slice(pos, end).split(delimiter);
          for (let c = 0; c < cells.length; c++) cells[c] = ownString(cells[c] as string);
          if (cells.length > MAX_CELLS) broken = tooWide(line);
          else batch.push({ cells, line });
        }
        if (next > end) line++;
      }
      if (broken === undefined) pos = next;
    }
    if (runFrom >= 0 && broken === undefined) readRun(text, pos);
    pending = pos === 0 ? text : text.slice(pos);
    if (broken !== undefined || follows === "end") return;
    if (follows === "stop" && quote !== null && pending.includes(quote)) {
      // Reading stopped inside a quoted record: a mistake csv-parse finds before that point comes first.
      // Read as if the file ended there, so nothing is held back; that its quote is still open is not one.
      const err = reader.machine.parse(Buffer.from(pending, "utf8"), true, ignore, ignore);
      if (err !== undefined && !(err instanceof CsvError && err.code === "CSV_QUOTE_NOT_CLOSED")) broken = parseBreak(err, line);
    }
    // Checked once a piece, so the cost is not paid per character.
    if (follows === "more" && pending.length > MAX_RECORD_SIZE) broken = tooLong(line);
  };

  // A record longer than LONG_RECORD waits as a list of pieces, and each new piece is scanned alone for
  // the record's end, so a record of many pieces is neither copied nor scanned again piece by piece.
  let held: string[] | undefined;
  let heldLength = 0;
  let heldInQuotes = false;
  const add = (piece: string): void => {
    if (held !== undefined) {
      const end = recordEnd(piece, 0, heldInQuotes, quote);
      held.push(piece);
      heldLength += piece.length;
      if (end < 0) {
        heldInQuotes = end === INSIDE_QUOTES;
        if (heldLength > MAX_RECORD_SIZE) broken = tooLong(line);
        return;
      }
      pending = held.join("");
      held = undefined;
    } else pending += piece;
    scan("more");
    if (broken === undefined && pending.length > LONG_RECORD) {
      const end = recordEnd(pending, 0, false, quote);
      if (end >= 0) return;
      held = [pending];
      heldLength = pending.length;
      heldInQuotes = end === INSIDE_QUOTES;
      pending = "";
    }
  };
  const unhold = (): void => {
    if (held === undefined) return;
    pending = held.join("");
    held = undefined;
  };

  const take = (): RawRecord[] => {
    const out = batch;
    batch = [];
    return out;
  };
  // Where reading stopped: the line after the last record, plus the line breaks read since.
  const reached = (): number => line + breaksIn(pending, 0, pending.length);

  try {
    for await (const chunk of chunks) {
      const d = decoder.decode(chunk);
      for (let at = 0; at < d.data.length && broken === undefined; at += TEXT_PIECE) {
        add(utf8.write(d.data.subarray(at, at + TEXT_PIECE)));
        if (batch.length > 0 && broken === undefined) yield take();
      }
      if (d.invalid !== undefined && broken === undefined) {
        unhold();
        scan("stop");
      }
      if (batch.length > 0) yield take();
      if (broken !== undefined) return stop(broken);
      if (d.invalid !== undefined) return stop({ line: reached(), message: `found ${d.invalid}` });
    }
  } catch (e) {
    unhold();
    scan("stop");
    if (batch.length > 0) yield take();
    return stop(broken ?? { line: reached(), message: `the file could not be read further: ${readError(e)}` });
  }
  // A character cut off at the end is the decoder's to report; StringDecoder.end() would make it U+FFFD.
  const last = decoder.end();
  unhold();
  pending += utf8.write(last.data);
  scan(last.invalid === undefined ? "end" : "stop");
  if (batch.length > 0) yield take();
  if (broken !== undefined) stop(broken);
  else if (last.invalid !== undefined) stop({ line: reached(), message: `found ${last.invalid}` });
}

const tooWide = (line: number): StructureBreak => ({ line, message: `the record starting at line ${line} has more than ${MAX_CELLS.toLocaleString("en-US")} cells` });
const tooLong = (line: number): StructureBreak => ({ line, message: `the record starting at line ${line} is longer than ${MAX_RECORD_SIZE.toLocaleString("en-US")} characters (a quote that never closes?)` });

/** A csv-parse error as a break at the line where the failing record starts. */
function parseBreak(err: unknown, line: number): StructureBreak {
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
