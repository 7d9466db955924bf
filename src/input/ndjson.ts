import { StringDecoder } from "node:string_decoder";
import { memberSources } from "./json-members.js";
import type { Decoder } from "./decode.js";
import { readError, TEXT_PIECE } from "./csv.js";
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
  let rest: string[] = [];
  let restLength = 0;
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
  // The start of an unfinished line waits as a list of pieces, joined once its end arrives: a long line
  // is neither copied nor searched again piece by piece.
  const lines = (s: string): void => {
    let i = s.indexOf("\n");
    if (i < 0) {
      rest.push(s);
      restLength += s.length;
      if (restLength > MAX_RECORD_SIZE && broken === undefined) tooLong();
      return;
    }
    let from = 0;
    if (restLength + i > MAX_RECORD_SIZE) return tooLong();
    record(rest.length === 0 ? s.slice(0, i) : rest.join("") + s.slice(0, i));
    rest = [];
    restLength = 0;
    from = i + 1;
    for (i = s.indexOf("\n", from); i >= 0 && broken === undefined; i = s.indexOf("\n", from)) {
      if (i - from > MAX_RECORD_SIZE) return tooLong();
      record(s.slice(from, i));
      from = i + 1;
    }
    if (broken === undefined && from < s.length) {
      rest.push(s.slice(from));
      restLength = s.length - from;
    }
  };
  const tooLong = (): void => {
    broken = { line: line + 1, message: `line ${line + 1} is longer than ${MAX_RECORD_SIZE / 1024 / 1024} Mi characters` };
    rest = [];
    restLength = 0;
  };
  const take = (): RawRecord[] => {
    const out = batch;
    batch = [];
    return out;
  };

  try {
    for await (const chunk of chunks) {
      const d = decoder.decode(chunk);
      // In 64 KB pieces: V8 allocates longer strings in its large-object space, at a high cost each.
      for (let at = 0; at < d.data.length && broken === undefined; at += TEXT_PIECE) lines(text.write(d.data.subarray(at, at + TEXT_PIECE)));
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
    const tail = rest.join("") + text.end();
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
