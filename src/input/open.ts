import { createHash } from "node:crypto";
import { createReadStream, type ReadStream } from "node:fs";
import { open as openFile } from "node:fs/promises";
import { pipeline } from "node:stream/promises";
import { createGunzip } from "node:zlib";
import { fail, ok, type Result } from "../problem.js";
import { createCsvReader, readCsv } from "./csv.js";
import { createDecoder } from "./decode.js";
import { everyChunk } from "./every-chunk.js";
import { readNdjson } from "./ndjson.js";
import type { ColumnLayout } from "../engine/prepare.js";
import type { Delivery, DeliverySummary, InputOptions, RawRecord, StructureBreak } from "./types.js";

/** Bytes per read; large enough that per-chunk costs vanish beside parsing. */
const CHUNK = 256 * 1024;

/** Bytes inflated per zlib call (see gunzipped). */
const GUNZIP_CHUNK = 16 * 1024;

/**
 * Opens a delivery for reading; a file that is missing, unreadable or a folder, or a dialect csv-parse
 * refuses, is a Problem naming the file. A `.gz` suffix means gzip-compressed.
 */
export async function openDelivery(path: string, options: InputOptions): Promise<Result<Delivery>> {
  let handle;
  try {
    handle = await openFile(path, "r");
    const stat = await handle.stat();
    if (!stat.isFile()) {
      await handle.close();
      return fail({ file: path, message: "is not a regular file" });
    }
  } catch (e) {
    await handle?.close();
    return fail({ file: path, message: `cannot be opened: ${describe(e)}` });
  }

  let parse: ((chunks: AsyncIterable<Buffer>) => AsyncGenerator<RawRecord[]>) | undefined;
  const decoder = createDecoder(options.encoding);
  let broken: StructureBreak | undefined;
  const stop = (b: StructureBreak): void => {
    broken = b;
  };
  if (options.format === "ndjson") {
    parse = (chunks) => readNdjson(chunks, decoder, stop);
  } else {
    const tsv = options.format === "tsv";
    const made = createCsvReader({
      delimiter: options.delimiter ?? (tsv ? "\t" : ","),
      quote: options.quote ?? (tsv ? null : '"'),
    });
    if ("error" in made) {
      await handle.close();
      return fail({ file: path, message: `cannot be read with these input options: ${made.error}` });
    }
    parse = (chunks) => readCsv(made.reader, chunks, decoder, stop);
  }

  const file = handle;
  const hash = createHash("sha256");
  let bytes = 0;
  let whole = false;
  let summary: DeliverySummary | undefined;
  const gzip = path.endsWith(".gz");

  async function* hashed(raw: ReadStream): AsyncGenerator<Buffer> {
    for await (const chunk of raw) {
      hash.update(chunk as Buffer);
      bytes += (chunk as Buffer).length;
      yield chunk as Buffer;
    }
    whole = true;
  }
  async function* gunzipped(raw: ReadStream): AsyncGenerator<Buffer> {
    // zlib drops what it inflated in the call that finds a broken stream; small calls lose little.
    const gunzip = createGunzip({ chunkSize: GUNZIP_CHUNK });
    raw.on("data", (chunk) => {
      hash.update(chunk as Buffer);
      bytes += (chunk as Buffer).length;
    });
    raw.once("end", () => {
      whole = true;
    });
    raw.pipe(gunzip);
    try {
      yield* everyChunk(gunzip);
    } finally {
      gunzip.destroy();
    }
  }

  async function* records(): AsyncGenerator<readonly RawRecord[]> {
    const raw = file.createReadStream({ highWaterMark: CHUNK });
    try {
      yield* parse!(gzip ? gunzipped(raw) : hashed(raw));
    } finally {
      raw.destroy();
      summary = { encoding: decoder.encoding(), ...noteOf(decoder.note()), ...(whole ? { bytes, sha256: hash.digest("hex") } : await hashFile(path)) };
    }
  }

  return ok(deliveryOf(records(), () => broken, () => bytes, () => summary));
}

/** A Delivery over records and the state its reader keeps; the summary exists once the records are read. */
export function deliveryOf(
  records: AsyncIterable<readonly RawRecord[]>,
  structureBreak: () => StructureBreak | undefined,
  bytesRead: () => number,
  summary: () => DeliverySummary | undefined,
  columnsFound?: (columns: ColumnLayout) => void,
): Delivery {
  return {
    records,
    ...(columnsFound === undefined ? {} : { columnsFound }),
    structureBreak,
    bytesRead,
    summary: () => {
      const s = summary();
      if (s === undefined) throw new Error("summary() asked before the records were read");
      return s;
    },
  };
}

const noteOf = (note: string | undefined): { note?: string } => (note === undefined ? {} : { note });

/** Size and SHA-256 of a file read anew, for when reading the records stopped before its end. */
async function hashFile(path: string): Promise<{ bytes: number; sha256: string }> {
  const hash = createHash("sha256");
  let bytes = 0;
  await pipeline(createReadStream(path, { highWaterMark: CHUNK }), async function (source: AsyncIterable<Buffer>) {
    for await (const chunk of source) {
      hash.update(chunk);
      bytes += chunk.length;
    }
  });
  return { bytes, sha256: hash.digest("hex") };
}

function describe(e: unknown): string {
  const code = (e as { code?: unknown } | null)?.code;
  if (code === "ENOENT") return "no such file";
  if (code === "EACCES" || code === "EPERM") return "permission denied";
  if (code === "EISDIR") return "is a folder";
  return e instanceof Error ? e.message : String(e);
}
