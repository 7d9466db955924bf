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
import { ABSENT, BLANK, createPreparer, INVALID, numberSlots, prepareSpecOf, SPACED, type ColumnLayout, type PreparedRows, type Preparer } from "./prepare.js";
import { createValueRebuilder } from "./rebuild-value.js";
import { cellValue, shownValue } from "./shown.js";

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
  /** Told where the declared columns are once the header has been read (the parse thread prepares rows by it). */
  readonly onHeader?: (layout: ColumnLayout) => void;
}

export interface EngineOutcome {
  /** Data records read (the header is not one; a ragged record is). */
  readonly rows: number;
  readonly collector: Collector;
  readonly profile?: ColumnProfile[];
}

/**
 * Run a plan over a delivery's records: the header first (unless `header: none`), then every data
 * record. Records from the parse thread come prepared (engine/prepare.ts); others are prepared here.
 * Holds one row of scratch arrays, the key and duplicate hashes (when rows are prepared here), group
 * accumulators and the numeric columns outliers need; nothing else grows with the file.
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
  const kinds = cols.map((c) => c.type);
  const { slots: numberAt, count: perRowNumbers } = numberSlots(kinds);
  const rebuild = createValueRebuilder(kinds);
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

  const checkRecord = (rec: RawRecord, h: HeaderMatch, prep: PreparedRows, r: number) => {
    const rowNo = ++rows;
    const line = rec.line;
    const cells = rec.cells;
    if (cells.length !== h.width) {
      emit(plan.file.width, rowNo, line, () => ({ value: String(cells.length), expected: plural(h.width, "cell"), message: `record has ${plural(cells.length, "cell")}, expected ${h.width}; its cells are not checked` }));
      end.skipped(line);
      return;
    }
    // Every cell first, from its prepared state: a column's `when` and the rules may read any other column.
    const base = r * n;
    const numberBase = r * perRowNumbers;
    for (let i = 0; i < n; i++) {
      const flags = prep.states[base + i] as number;
      const s = flags & 3;
      state[i] = s;
      if (s === ABSENT) {
        values[i] = null;
        texts[i] = "";
        raws[i] = "";
        continue;
      }
      const raw = cells[h.positions[i] as number] ?? "";
      raws[i] = raw;
      if (s === BLANK) {
        values[i] = null;
        texts[i] = "";
        continue;
      }
      const text = (flags & SPACED) === 0 ? raw : raw.trim();
      texts[i] = text;
      values[i] = s === INVALID ? null : rebuild(i, text, prep.numbers[numberBase + (numberAt[i] as number)] as number, flags);
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
    const repeats = r * (plan.keys.length + 1);
    for (let k = 0; k < plan.keys.length; k++) {
      const key = plan.keys[k] as (typeof plan.keys)[number];
      const first = prep.repeats[repeats + k] as number;
      if (first > 0) {
        emit(key.check, rowNo, line, () => {
          const value = key.columns.map((c) => cellValue(raws[c] as string, cols[c]?.sensitive === true)).join(", ");
          const shown = key.columns.map((c) => shownValue(raws[c] as string, cols[c]?.sensitive === true)).join(", ");
          const names = key.columns.map((c) => cols[c]?.name).join(" + ");
          return { column: cols[key.columns[0] ?? 0]?.name ?? "", value, expected: "a unique key", message: `${names} (${shown}) repeats the key of row ${first}` };
        });
      }
    }
    if (plan.duplicates !== undefined) {
      const first = prep.repeats[repeats + plan.keys.length] as number;
      if (first > 0) emit(plan.duplicates, rowNo, line, () => ({ expected: "a row seen once", message: `row repeats row ${first} exactly` }));
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

  // Rows from the parse thread come prepared; rows read on this thread are prepared here, batch by batch.
  let preparer: Preparer | undefined;
  for await (const batch of batches) {
    let b = 0;
    if (header === undefined && batch.length > 0) {
      const rec = batch[0] as RawRecord;
      header = matchHeader(plan, rec.cells, rec.line);
      for (const hf of header.findings) if (out.fail(hf.check, 0)) out.keep(hf.check, hf.finding);
      for (const [check, n] of header.more ?? []) for (let k = 0; k < n; k++) out.fail(check, 0);
      options.onHeader?.(header);
      b = 1;
    }
    if (header !== undefined && b < batch.length) {
      const h = header;
      if ((batch[b] as RawRecord).prepared !== undefined) {
        for (; b < batch.length; b++) {
          const rec = batch[b] as RawRecord;
          checkRecord(rec, h, rec.prepared as PreparedRows, rec.at ?? 0);
        }
      } else {
        const prep = (preparer ??= createPreparer(prepareSpecOf(plan, options.sizeHint), h)).prepare(batch, b, batch.length);
        for (let r = 0; b < batch.length; b++, r++) checkRecord(batch[b] as RawRecord, h, prep, r);
      }
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
