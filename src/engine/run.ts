import type { Plan } from "../contract/plan.js";
import { isFalse, isTrue } from "../expr/index.js";
import type { RawRecord, StructureBreak } from "../input/index.js";
import type { ColumnProfile, Finding, Level } from "../report/model.js";
import { plural } from "../report/wording.js";
import type { Value } from "../values.js";
import { createCollector, type Collector } from "./collector.js";
import { createFileEnd } from "./file-end.js";
import { matchHeader, positional, type HeaderMatch } from "./header.js";
import { createProfiler } from "./profile.js";
import { createU32List } from "./growable.js";
import { keyPart } from "./key-text.js";
import { createRowHasher } from "./row-hash.js";
import { createSeenSet, type SeenSet } from "./seen-set.js";
import { cellValue, shownValue } from "./shown.js";

/**
 * Whether String.prototype.trim could remove this UTF-16 unit: its white space and line terminators
 * (ECMA-262 §22.1.3.32: Zs, tab, VT, FF, U+FEFF, LF, CR, U+2028, U+2029). Most cells start and end
 * with neither, and this test is cheaper than trimming them.
 */
function mayTrim(c: number): boolean {
  return c <= 32 || c === 160 || (c >= 0x1680 && (c === 0x1680 || (c >= 0x2000 && c <= 0x200a) || c === 0x2028 || c === 0x2029 || c === 0x202f || c === 0x205f || c === 0x3000 || c === 0xfeff));
}

export interface EngineOptions {
  readonly maxFindings: number;
  /** Also summarise every column for people (the HTML report). */
  readonly profile?: boolean;
  /** The file's size in bytes, to size the key and duplicate tables up front. */
  readonly sizeHint?: number;
  /** Called after each batch of records with the rows read so far. */
  readonly onBatch?: (rows: number) => void;
  /** Told of every failure of a row-level check (cell checks, width, keys, duplicates, rules), kept or not. */
  readonly onRowFailure?: (check: number, row: number, level: Level) => void;
}

export interface EngineOutcome {
  /** Data records read (the header is not one; a ragged record is). */
  readonly rows: number;
  readonly collector: Collector;
  readonly profile?: ColumnProfile[];
}

/**
 * Run a plan over a delivery's records: the header first (unless `header: none`), then every data
 * record. Holds one row of scratch arrays, key and duplicate hashes, group accumulators and the numeric
 * columns outliers need; nothing else grows with the file.
 */
export async function runPlan(plan: Plan, batches: AsyncIterable<readonly RawRecord[]>, structureBreak: () => StructureBreak | undefined, options: EngineOptions): Promise<EngineOutcome> {
  const out = createCollector(plan.checks, options.maxFindings);
  const cols = plan.columns;
  const n = cols.length;
  const values: Value[] = new Array<Value>(n).fill(null);
  const texts: string[] = new Array<string>(n).fill("");
  const raws: string[] = new Array<string>(n).fill("");
  const state = new Uint8Array(n); // 0 ok, 1 blank, 2 type error, 3 absent
  const row = { values, texts };
  const blank = plan.input.blank;
  // Most cells are longer than any blank marker ("NA", "N/A"), so only short ones meet the set.
  let blankMax = 0;
  for (const b of blank) blankMax = Math.max(blankMax, b.length);
  // A whole-row duplicate repeats its key too. So with a key, each row's hash waits in a sequential
  // list (8 bytes a row, written in order) and only rows whose first key repeats, or is incomplete,
  // meet the duplicate table: one random memory access a row instead of two.
  const rowHashes = plan.keys.length > 0 && plan.duplicates !== undefined ? createU32List(1 << 16) : undefined;
  // Sized once from the first batch and the file's size, so the tables rarely have to grow (each
  // growth re-inserts every entry at random places in memory).
  let keySets: SeenSet[] = [];
  let dupSet: SeenSet | undefined;
  const sizeTables = (batch: readonly RawRecord[]) => {
    let chars = 0;
    for (const rec of batch) for (const c of rec.cells) chars += c.length + 1;
    const perRow = batch.length > 0 ? Math.max(1, chars / batch.length) : 100;
    const rows = options.sizeHint === undefined ? 0 : Math.min(options.sizeHint / perRow, 50_000_000);
    let slots = 1 << 12;
    while (slots < rows * 2) slots *= 2;
    keySets = plan.keys.map(() => createSeenSet(slots));
    dupSet = plan.duplicates === undefined ? undefined : createSeenSet(rowHashes ? 1 << 10 : slots);
  };
  const hasher = createRowHasher();
  const end = createFileEnd(plan, out);
  const profiler = options.profile ? createProfiler(plan) : undefined;
  let header: HeaderMatch | undefined = plan.input.header === "none" ? positional(plan) : undefined;
  let rows = 0;

  const levelOf = (check: number): Level => plan.checks[check]?.level ?? "error";
  // Counting is exact for every failure; the finding itself (strings and all) is built only when kept.
  type Parts = Omit<Finding, "rule" | "level" | "row" | "line">;
  const onRowFailure = options.onRowFailure;
  const emit = (check: number, rowNo: number, line: number, make: () => Parts, level?: Level) => {
    onRowFailure?.(check, rowNo, level ?? levelOf(check));
    if (out.fail(check, rowNo, level)) out.keep(check, { rule: plan.checks[check]?.rule ?? "", level: level ?? levelOf(check), row: rowNo, line, ...make() });
  };

  type Column = (typeof cols)[number];
  const emitSpaces = (col: Column, raw: string, rowNo: number, line: number) =>
    emit(col.spacesCheck, rowNo, line, () => ({ column: col.name, value: cellValue(raw, col.sensitive), expected: "no leading or trailing spaces", message: `${col.name} ${shownValue(raw, col.sensitive)} has leading or trailing spaces` }));

  const checkRecord = (rec: RawRecord, h: HeaderMatch) => {
    const rowNo = ++rows;
    const line = rec.line;
    const cells = rec.cells;
    if (cells.length !== h.width) {
      rowHashes?.push(0);
      rowHashes?.push(0);
      emit(plan.file.width, rowNo, line, () => ({ value: String(cells.length), expected: plural(h.width, "cell"), message: `record has ${plural(cells.length, "cell")}, expected ${h.width}; its cells are not checked` }));
      end.skipped(line);
      return;
    }
    // Parse every cell first: a column's `when` and the rules may read any other column.
    for (let i = 0; i < n; i++) {
      const pos = h.positions[i] ?? -1;
      if (pos < 0) {
        values[i] = null;
        texts[i] = "";
        raws[i] = "";
        state[i] = 3;
        continue;
      }
      const raw = cells[pos] ?? "";
      const text = raw.length > 0 && (mayTrim(raw.charCodeAt(0)) || mayTrim(raw.charCodeAt(raw.length - 1))) ? raw.trim() : raw;
      raws[i] = raw;
      if (text === "" || (text.length <= blankMax && blank.has(text))) {
        values[i] = null;
        texts[i] = "";
        state[i] = 1;
        continue;
      }
      texts[i] = text;
      const v = (cols[i] as (typeof cols)[number]).parse(text);
      if (v === undefined) {
        values[i] = null;
        state[i] = 2;
      } else {
        values[i] = v;
        state[i] = 0;
      }
    }
    for (let i = 0; i < n; i++) {
      const col = cols[i] as (typeof cols)[number];
      const s = state[i];
      if (s === 3) continue;
      if (col.when !== undefined && !isTrue(col.when.evaluate(values))) continue;
      const raw = raws[i] as string;
      const text = texts[i] as string;
      if (s === 1) {
        // A blank marker written with spaces (" NA ") still had spaces; a cell of spaces alone is just blank.
        if (col.spacesCheck >= 0 && raw.length > 0) {
          const trimmed = raw.trim();
          if (trimmed !== raw && trimmed !== "") emitSpaces(col, raw, rowNo, line);
        }
        if (col.required) emit(col.requiredCheck, rowNo, line, () => ({ column: col.name, value: cellValue(raw, col.sensitive), expected: "a value", message: `${col.name} is blank but required` }));
        continue;
      }
      if (s === 2) {
        // A cell that does not parse is one finding; its other checks, spaces included, are skipped.
        emit(col.typeCheck, rowNo, line, () => ({ column: col.name, value: cellValue(raw, col.sensitive), expected: col.expected, message: `${col.name} ${shownValue(raw, col.sensitive)} is not ${col.expected}` }));
        continue;
      }
      if (col.spacesCheck >= 0 && raw !== text) emitSpaces(col, raw, rowNo, line);
      const checks = col.cellChecks;
      for (let c = 0; c < checks.length; c++) {
        const cc = checks[c] as (typeof checks)[number];
        const m = cc.test(values[i] as Value, text, row);
        if (m === undefined) continue;
        emit(cc.check, rowNo, line, () => ({ column: col.name, value: cellValue(raw, col.sensitive), expected: m.expected, message: `${col.name} ${shownValue(raw, col.sensitive)} ${m.reason}` }), m.level);
      }
    }
    let rowHi = 0;
    let rowLo = 0;
    if (plan.duplicates !== undefined) {
      hasher.reset();
      for (let c = 0; c < cells.length; c++) hasher.add(cells[c] as string);
      rowHi = hasher.hi;
      rowLo = hasher.lo;
    }
    // The first key's outcome: 0 unique so far, -1 incomplete, else the row it repeats.
    let firstKey = 0;
    for (let k = 0; k < plan.keys.length; k++) {
      const key = plan.keys[k] as (typeof plan.keys)[number];
      hasher.reset();
      let complete = true;
      for (const c of key.columns) {
        // A part that is blank or fails its type is NULL: as SQL UNIQUE, such a key never repeats.
        if (state[c] !== 0) complete = false;
        hasher.add(keyPart(values[c] as Value, texts[c] as string, state[c] as number));
      }
      if (!complete) {
        if (k === 0) firstKey = -1;
        continue;
      }
      const first = (keySets[k] as SeenSet).firstOrAdd(hasher.hi, hasher.lo, rowNo);
      if (k === 0) firstKey = first;
      if (first !== 0) {
        emit(key.check, rowNo, line, () => {
          const value = key.columns.map((c) => cellValue(raws[c] as string, cols[c]?.sensitive === true)).join(", ");
          const shown = key.columns.map((c) => shownValue(raws[c] as string, cols[c]?.sensitive === true)).join(", ");
          const names = key.columns.map((c) => cols[c]?.name).join(" + ");
          return { column: cols[key.columns[0] ?? 0]?.name ?? "", value, expected: "a unique key", message: `${names} (${shown}) repeats the key of row ${first}` };
        });
      }
    }
    if (dupSet !== undefined && plan.duplicates !== undefined) {
      let first = 0;
      if (rowHashes === undefined || firstKey === -1) first = dupSet.firstOrAdd(rowHi, rowLo, rowNo);
      else if (firstKey > 0) {
        // The row whose key this one repeats joins the table first (a no-op when it already has).
        dupSet.firstOrAdd(rowHashes.at(2 * (firstKey - 1)), rowHashes.at(2 * (firstKey - 1) + 1), firstKey);
        first = dupSet.firstOrAdd(rowHi, rowLo, rowNo);
      }
      rowHashes?.push(rowHi);
      rowHashes?.push(rowLo);
      if (first !== 0) emit(plan.duplicates, rowNo, line, () => ({ expected: "a row seen once", message: `row repeats row ${first} exactly` }));
    }
    for (const rule of plan.rules) {
      if (rule.when !== undefined && !isTrue(rule.when.evaluate(values))) continue;
      if (!isFalse(rule.assert.evaluate(values))) continue;
      emit(rule.check, rowNo, line, () => {
        const shown = rule.assert.columns.map((c) => `${cols[c]?.name}=${state[c] === 1 ? "(blank)" : shownValue(raws[c] as string, cols[c]?.sensitive === true)}${state[c] === 2 ? " (invalid)" : ""}`).join(", ");
        const first = rule.assert.columns[0];
        return {
          ...(first === undefined ? {} : { column: cols[first]?.name ?? "" }),
          value: shown,
          expected: rule.assert.source,
          message: `${rule.message ?? `${rule.assert.source} is false`} (${shown})`,
        };
      });
    }
    end.row(values, texts, raws, state, rowNo, line);
    profiler?.row(values, texts, state);
  };

  let sized = false;
  for await (const batch of batches) {
    if (!sized) {
      sizeTables(batch);
      sized = true;
    }
    for (let b = 0; b < batch.length; b++) {
      const rec = batch[b] as RawRecord;
      if (header === undefined) {
        header = matchHeader(plan, rec.cells, rec.line);
        for (const hf of header.findings) if (out.fail(hf.check, 0)) out.keep(hf.check, hf.finding);
        for (const [check, n] of header.more ?? []) for (let k = 0; k < n; k++) out.fail(check, 0);
        continue;
      }
      checkRecord(rec, header);
    }
    options.onBatch?.(rows);
  }
  const broke = structureBreak();
  // An empty file has a header that names nothing; a file that broke before its header has none to judge.
  if (header === undefined && broke === undefined) {
    header = matchHeader(plan, [], 1);
    for (const hf of header.findings) if (out.fail(hf.check, 0)) out.keep(hf.check, hf.finding);
  }
  if (broke) {
    const meta = plan.checks[plan.file.structure];
    if (out.fail(plan.file.structure, 0)) {
      const before = rows === 1 ? "1 record before it was checked" : `${rows} records before it were checked`;
      out.keep(plan.file.structure, { rule: meta?.rule ?? "file.structure", level: "error", line: broke.line, expected: "a file readable to its end", message: `${broke.message}; reading stopped at line ${broke.line}, ${before}` });
    }
  }
  end.finish(rows);
  return { rows, collector: out, ...(profiler ? { profile: profiler.result() } : {}) };
}
