import { createHash } from "node:crypto";
import { parse } from "csv-parse/sync";
import { firstInvalid } from "../input/utf8.js";
import { fail, ok, type Problem, type Result } from "../problem.js";
import type { ManifestTable, RefColumnType } from "./manifest.js";
import { makeRefTable, type RefTable } from "./ref-table.js";

/** Where a table's CSV and manifest entry live, for problem positions and RefTable.file/origin. */
export interface TableContext {
  /** CSV path as shown in problems and RefTable.file */
  readonly file: string;
  /** manifest path as shown in problems and RefTable.origin */
  readonly manifestFile: string;
  readonly builtIn: boolean;
}

/** Beyond this many problems in one table the rest are summarised in one line. */
const MAX_PROBLEMS = 50;

const TYPE_CHECKS: Record<RefColumnType, (v: string) => boolean> = {
  text: () => true,
  // As a delivery's integer and decimal columns read them: a sign may lead, a decimal may start or end with its point.
  integer: (v) => /^[+-]?[0-9]+$/.test(v),
  decimal: (v) => /^[+-]?([0-9]+(\.[0-9]*)?|\.[0-9]+)$/.test(v),
  boolean: (v) => v === "true" || v === "false",
  date: isIsoDate,
};

function isIsoDate(v: string): boolean {
  const m = /^([0-9]{4})-([0-9]{2})-([0-9]{2})$/.exec(v);
  if (!m) return false;
  const y = Number(m[1]), mo = Number(m[2]), d = Number(m[3]);
  const t = new Date(Date.UTC(y, mo - 1, d));
  return t.getUTCFullYear() === y && t.getUTCMonth() === mo - 1 && t.getUTCDate() === d;
}

const hasStraySpace = (v: string): boolean => /^\s|\s$/.test(v);

/** SHA-256 (hex) of bytes, as written into the lock. */
export function sha256Hex(bytes: Uint8Array): string {
  return createHash("sha256").update(bytes).digest("hex");
}

interface ParsedRecord {
  readonly cells: string[];
  readonly line: number;
}

function readRecords(bytes: Uint8Array, file: string): Result<ParsedRecord[]> {
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    const buf = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    const at = Math.max(0, firstInvalid(buf, 0, buf.length));
    return fail({ file, line: buf.subarray(0, at).toString("utf8").split("\n").length, message: "table is not valid UTF-8 on this line" });
  }
  let raw: { record: string[]; info: { lines: number; empty_lines: number } }[];
  // Where the last good record ended, so a record that cannot be read is named by the line it starts on.
  let lastEnd = 0;
  let lastEmpty = 0;
  try {
    raw = parse(text, {
      info: true, bom: true, relax_column_count: true, skip_empty_lines: true,
      // Every line break ends a record, as in deliveries: a table edited on two systems mixes them.
      record_delimiter: ["\r\n", "\n", "\r"],
      on_record: (record: string[], context: { lines: number; empty_lines: number }) => {
        lastEnd = context.lines;
        lastEmpty = context.empty_lines;
        return record;
      },
    }) as unknown as typeof raw;
  } catch (e) {
    const err = e as { empty_lines?: number; code?: string };
    const line = lastEnd + 1 + Math.max(0, (err.empty_lines ?? lastEmpty) - lastEmpty);
    return fail({ file, line, message: `the record starting on this line is not readable CSV (${err.code ?? "parse error"})` });
  }
  const out: ParsedRecord[] = [];
  let prevEnd = 0;
  let prevEmpty = 0;
  for (const r of raw) {
    // csv-parse reports the line a record ends on; the start follows the previous record and any blank lines.
    out.push({ cells: r.record, line: prevEnd + 1 + (r.info.empty_lines - prevEmpty) });
    prevEnd = r.info.lines;
    prevEmpty = r.info.empty_lines;
  }
  return ok(out);
}

/**
 * Check a table's CSV bytes against its manifest entry and build its lookups: header present, no
 * duplicate or undeclared columns, every declared column present, widths right, key non-blank and
 * unique, cells of their declared type, no leading or trailing spaces anywhere.
 */
export function parseCsvTable(entry: ManifestTable, bytes: Uint8Array, ctx: TableContext): Result<RefTable> {
  const { file } = ctx;
  const read = readRecords(bytes, file);
  if (!read.ok) return read;
  const [headerRecord, ...body] = read.value;
  const problems: Problem[] = [];
  const push = (p: Problem): void => {
    problems.push(p);
  };
  const atManifest = (pos: { line: number; column: number }, message: string): Problem => ({ file: ctx.manifestFile, line: pos.line, column: pos.column, message });
  if (!headerRecord) return fail({ file, line: 1, message: "table has no header row" });
  const header = headerRecord.cells;
  const seen = new Set<string>();
  header.forEach((h, i) => {
    if (h === "") push({ file, line: 1, message: `header cell ${i + 1} is blank` });
    else if (hasStraySpace(h)) push({ file, line: 1, message: `header "${h}" has leading or trailing spaces` });
    if (seen.has(h)) push({ file, line: 1, message: `header "${h}" appears twice` });
    seen.add(h);
  });
  const keyIndex = header.indexOf(entry.key);
  if (keyIndex < 0) push(atManifest(entry.at.key, `key column "${entry.key}" is not in ${file}`));
  let types: RefColumnType[] = header.map(() => "text");
  if (entry.columns) {
    const declared = new Map(entry.columns.map((c) => [c.name, c.type] as const));
    for (const c of entry.columns) {
      if (!header.includes(c.name)) push(atManifest(entry.at.columns, `declared column "${c.name}" is not in ${file}`));
    }
    for (const h of header) {
      if (h !== "" && !declared.has(h)) push({ file, line: 1, message: `column "${h}" is not declared in ${ctx.manifestFile}` });
    }
    types = header.map((h) => declared.get(h) ?? "text");
  }
  if (problems.length > 0) return fail(...problems);

  const firstLineOfKey = new Map<string, number>();
  const records: string[][] = [];
  for (const { cells, line } of body) {
    if (problems.length >= MAX_PROBLEMS) break;
    if (cells.length !== header.length) {
      push({ file, line, message: `row has ${cells.length} cell${cells.length === 1 ? "" : "s"}, the header has ${header.length}` });
      continue;
    }
    cells.forEach((v, i) => {
      const column = header[i] ?? String(i + 1);
      // A key of only spaces is reported once, as a blank key, below.
      if (i === keyIndex && v.trim() === "") return;
      if (hasStraySpace(v)) push({ file, line, message: `cell in column "${column}" has leading or trailing spaces` });
      else if (v !== "" && !TYPE_CHECKS[types[i] ?? "text"](v)) push({ file, line, message: `cell in column "${column}" is not of type ${types[i] ?? "text"}: "${v}"` });
    });
    const key = cells[keyIndex] ?? "";
    if (key.trim() === "") push({ file, line, message: `key "${entry.key}" is blank` });
    else {
      const first = firstLineOfKey.get(key);
      if (first !== undefined) push({ file, line, message: `key "${key}" repeats the row at line ${first}` });
      else firstLineOfKey.set(key, line);
    }
    records.push(cells);
  }
  if (problems.length >= MAX_PROBLEMS) push({ file, message: `stopped after ${MAX_PROBLEMS} problems` });
  if (problems.length > 0) return fail(...problems);
  return ok(
    makeRefTable(
      {
        name: entry.name,
        version: entry.version,
        ...(entry.source !== undefined ? { source: entry.source } : {}),
        ...(entry.description !== undefined ? { description: entry.description } : {}),
        file,
        builtIn: ctx.builtIn,
        origin: ctx.manifestFile,
        declaredAt: entry.at.name,
        key: entry.key,
        columns: header,
        types,
        sha256: sha256Hex(bytes),
      },
      records,
    ),
  );
}
