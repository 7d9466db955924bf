import { writeFileSync } from "node:fs";
import { join } from "node:path";
import { createCsvReader, readCsv } from "../../src/input/csv.js";
import { createDecoder } from "../../src/input/decode.js";
import { openDelivery } from "../../src/input/index.js";
import { readNdjson } from "../../src/input/ndjson.js";
import { tempDir } from "../helpers/temp-dir.js";
import type { DeliverySummary, InputOptions, RawRecord, StructureBreak } from "../../src/input/index.js";

const dir = tempDir("tablegate-input-");
let serial = 0;

/** Writes bytes to a fresh temporary file with the given suffix and returns its path. */
export function tempFile(bytes: Buffer | string, suffix = ".csv"): string {
  const path = join(dir, `f${++serial}${suffix}`);
  writeFileSync(path, bytes);
  return path;
}

export interface Read {
  readonly records: RawRecord[];
  readonly rows: string[][];
  readonly lines: number[];
  readonly stop: StructureBreak | undefined;
  readonly summary: DeliverySummary;
}

export const CSV: InputOptions = { format: "csv", encoding: "utf-8" };

/** Opens bytes as a delivery file and reads it to the end. */
export async function readBytes(bytes: Buffer | string, options: Partial<InputOptions> = {}, suffix = ".csv"): Promise<Read> {
  const opened = await openDelivery(tempFile(bytes, suffix), { ...CSV, ...options });
  if (!opened.ok) throw new Error(opened.problems.map((p) => p.message).join("; "));
  const records: RawRecord[] = [];
  for await (const batch of opened.value.records) for (const r of batch) records.push(r);
  return {
    records,
    rows: records.map((r) => [...r.cells]),
    lines: records.map((r) => r.line),
    stop: opened.value.structureBreak(),
    summary: opened.value.summary(),
  };
}

async function* pieces(bytes: Buffer, size: number): AsyncGenerator<Buffer> {
  for (let i = 0; i < bytes.length; i += size) yield Buffer.from(bytes.subarray(i, i + size));
}

/** Reads bytes through the same parser and decoder as a file, but in chunks of `size` bytes, to cross every boundary. */
export async function readChunked(bytes: Buffer, options: Partial<InputOptions>, size: number): Promise<{ rows: string[][]; lines: number[]; stop: StructureBreak | undefined }> {
  const o = { ...CSV, ...options };
  const decoder = createDecoder(o.encoding);
  let stop: StructureBreak | undefined;
  const onStop = (b: StructureBreak): void => {
    stop = b;
  };
  let gen: AsyncGenerator<RawRecord[]>;
  if (o.format === "ndjson") gen = readNdjson(pieces(bytes, size), decoder, onStop);
  else {
    const tsv = o.format === "tsv";
    const made = createCsvReader({ delimiter: o.delimiter ?? (tsv ? "\t" : ","), quote: o.quote ?? (tsv ? null : '"') });
    if ("error" in made) throw new Error(made.error);
    gen = readCsv(made.reader, pieces(bytes, size), decoder, onStop);
  }
  const records: RawRecord[] = [];
  for await (const batch of gen) for (const r of batch) records.push(r);
  return { rows: records.map((r) => [...r.cells]), lines: records.map((r) => r.line), stop };
}
