import { StringDecoder } from "node:string_decoder";
import { memberSources } from "./json-members.js";
import type { Decoder } from "./decode.js";
import { readError } from "./csv.js";
import { MAX_RECORD_SIZE, type RawRecord, type StructureBreak } from "./types.js";

/**
 * Records of an NDJSON byte stream (one JSON object per LF-ended line), in batches. The first object's
 * keys form a header record, yielded first at that object's line; each object then gives its values in
 * header order, '' for a missing key or null, and values of keys the header lacks appended after them
 * (so the record is wider and the engine reports its width). A line that is not a JSON object stops
 * reading there; blank lines are skipped but counted.
 */
export async function* readNdjson(
  chunks: AsyncIterable<Buffer>,
  decoder: Decoder,
  stop: (b: StructureBreak) => void,
): AsyncGenerator<RawRecord[]> {
  const text = new StringDecoder("utf8");
  let rest = "";
  let line = 0;
  let header: string[] | undefined;
  let known: Set<string> | undefined;
  let batch: RawRecord[] = [];
  let broken: StructureBreak | undefined;

  const record = (source: string): void => {
    line++;
    if (source.trim() === "") return;
    let value: unknown;
    try {
      value = JSON.parse(source);
    } catch {
      broken = { line, message: `line ${line} is not valid JSON` };
      return;
    }
    if (value === null || typeof value !== "object" || Array.isArray(value)) {
      broken = { line, message: `line ${line} is not a JSON object` };
      return;
    }
    const obj = value as Record<string, unknown>;
    if (header === undefined) {
      header = Object.keys(obj);
      known = new Set(header);
      batch.push({ cells: header, line });
    }
    // Numbers keep the digits the file wrote (2.50, 12345678901234567890): JSON.parse would round them.
    let sources: Map<string, string> | undefined;
    const text = (k: string): string => {
      const v = obj[k];
      if (typeof v !== "number") return cellText(v);
      sources ??= memberSources(source);
      return sources.get(k) ?? cellText(v);
    };
    const cells = header.map(text);
    for (const k of Object.keys(obj)) if (!known!.has(k)) cells.push(text(k));
    batch.push({ cells, line });
  };
  const lines = (s: string): void => {
    const all = rest + s;
    let from = 0;
    for (let i = all.indexOf("\n"); i >= 0 && broken === undefined; i = all.indexOf("\n", from)) {
      if (i - from > MAX_RECORD_SIZE) return tooLong();
      record(all.slice(from, i));
      from = i + 1;
    }
    rest = all.slice(from);
    if (rest.length > MAX_RECORD_SIZE && broken === undefined) tooLong();
  };
  const tooLong = (): void => {
    broken = { line: line + 1, message: `line ${line + 1} is longer than ${MAX_RECORD_SIZE / 1024 / 1024} Mi characters` };
    rest = "";
  };
  const take = (): RawRecord[] => {
    const out = batch;
    batch = [];
    return out;
  };

  try {
    for await (const chunk of chunks) {
      const d = decoder.decode(chunk);
      lines(text.write(d.data));
      if (batch.length > 0) yield take();
      if (broken !== undefined) return stop(broken);
      if (d.invalid !== undefined) return stop({ line: line + 1, message: `found ${d.invalid}` });
    }
  } catch (e) {
    if (batch.length > 0) yield take();
    return stop({ line: line + 1, message: `the file could not be read further: ${readError(e)}` });
  }
  const last = decoder.end();
  lines(text.write(last.data));
  if (broken === undefined && last.invalid !== undefined) broken = { line: line + 1, message: `found ${last.invalid}` };
  if (broken === undefined && last.invalid === undefined) {
    const tail = rest + text.end();
    if (tail !== "") record(tail);
  }
  if (batch.length > 0) yield take();
  if (broken !== undefined) stop(broken);
}

/** A JSON value as cell text: strings as they are, null as blank, booleans in JSON form, objects as JSON. */
function cellText(v: unknown): string {
  if (v === undefined || v === null) return "";
  if (typeof v === "string") return v;
  if (typeof v === "object") return JSON.stringify(v);
  return String(v);
}
