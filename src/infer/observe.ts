import { openDelivery, type RawRecord } from "../input/index.js";
import { fail, ok, type Result } from "../problem.js";
import { createColumnObserver, type ColumnSummary } from "./column-observer.js";
import { createKeyTracker, type KeyTracker } from "./key-tracker.js";
import { suggestsDate } from "./names.js";
import { createRowRepeats, type RowRepeats } from "./row-repeats.js";

/** How to read the delivery; `auto` encoding as the draft proposes to find out. */
export interface ObserveOptions {
  readonly format: "csv" | "tsv" | "ndjson";
  /** csv only; when absent, `,` unless the header only splits on `;`, a tab or `|`. */
  readonly delimiter?: string;
}

/** Everything a draft is decided from: one pass over the file, bounded memory apart from the key sets. */
export interface Observation {
  readonly format: "csv" | "tsv" | "ndjson";
  /** The csv delimiter used. */
  readonly delimiter?: string;
  /** The encoding `auto` settled on. */
  readonly encoding: string;
  /** Header names, trimmed, in file order. */
  readonly header: readonly string[];
  /** Records of the header's width. */
  readonly rows: number;
  /** Records of another width: how many, and the line of the first. */
  readonly ragged: { readonly count: number; readonly firstLine: number };
  readonly columns: readonly ColumnSummary[];
  readonly keys: KeyTracker;
  readonly repeats: RowRepeats;
}

const OTHER_DELIMITERS = [";", "\t", "|"];

/**
 * Read a delivery once and summarise every column. A file that is missing or unreadable, has no
 * header, repeats a header name, or cannot be read to its end (a structure break) is a Problem naming
 * the file (and line): a draft inferred from part of a file would describe a file that does not exist.
 */
export async function observeDelivery(path: string, options: ObserveOptions): Promise<Result<Observation>> {
  const first = await observeWith(path, options.format, options.delimiter ?? (options.format === "csv" ? "," : undefined));
  if (first.ok || options.format !== "csv" || options.delimiter !== undefined || first.retry === undefined) return first.result;
  return (await observeWith(path, "csv", first.retry)).result;
}

type Attempt = { ok: boolean; result: Result<Observation>; retry?: string };

async function observeWith(path: string, format: ObserveOptions["format"], delimiter: string | undefined): Promise<Attempt> {
  const opened = await openDelivery(path, { format, encoding: "auto", ...(delimiter === undefined ? {} : { delimiter }) });
  if (!opened.ok) return { ok: false, result: opened };
  const delivery = opened.value;
  let header: string[] | undefined;
  let observers: ReturnType<typeof createColumnObserver>[] = [];
  let keys: KeyTracker | undefined;
  const repeats = createRowRepeats();
  let rows = 0;
  let raggedCount = 0;
  let raggedLine = 0;

  for await (const batch of delivery.records) {
    for (let b = 0; b < batch.length; b++) {
      const rec = batch[b] as RawRecord;
      if (header === undefined) {
        header = rec.cells.map((c) => c.trim());
        const retry = format === "csv" && header.length === 1 ? OTHER_DELIMITERS.find((d) => (rec.cells[0] ?? "").includes(d)) : undefined;
        if (retry !== undefined) return { ok: false, result: fail({ file: path, message: "" }), retry };
        const twice = header.findIndex((h, i) => header!.indexOf(h) !== i);
        if (twice >= 0) {
          return { ok: false, result: fail({ file: path, line: rec.line, column: twice + 1, message: `the header repeats the column name ${JSON.stringify(header[twice])}: a contract needs distinct names` }) };
        }
        observers = header.map((h) => createColumnObserver(h, suggestsDate(h)));
        keys = createKeyTracker(header.length);
        continue;
      }
      const cells = rec.cells;
      if (cells.length !== header.length) {
        if (raggedCount++ === 0) raggedLine = rec.line;
        continue;
      }
      rows++;
      for (let c = 0; c < cells.length; c++) (observers[c] as (typeof observers)[number]).observe(cells[c] as string);
      keys!.observe(cells);
      repeats.observe(cells);
    }
  }
  const broken = delivery.structureBreak();
  if (broken !== undefined) {
    return { ok: false, result: fail({ file: path, line: broken.line, ...(broken.column === undefined ? {} : { column: broken.column }), message: `cannot infer a contract from a file that cannot be read to its end: ${broken.message}` }) };
  }
  if (header === undefined || keys === undefined) return { ok: false, result: fail({ file: path, message: "has no header record: nothing to infer from" }) };
  return {
    ok: true,
    result: ok({
      format,
      ...(format === "csv" && delimiter !== undefined ? { delimiter } : {}),
      encoding: delivery.summary().encoding,
      header,
      rows,
      ragged: { count: raggedCount, firstLine: raggedLine },
      columns: observers.map((o) => o.summary()),
      keys,
      repeats,
    }),
  };
}
