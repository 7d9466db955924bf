import type { GroupPlan, Plan } from "../contract/plan.js";
import { createGroupTable, isFalse, isTrue } from "../expr/index.js";
import { createFloatColumn, findOutliers } from "../stats/index.js";
import { formatValue } from "../types/index.js";
import type { Value } from "../values.js";
import type { Collector } from "./collector.js";
import { createU32List, type U32List } from "./growable.js";
import { createRowHasher } from "./row-hash.js";
import { joinParts, keyPart, splitParts } from "./key-text.js";
import { createSeenSet, type SeenSet } from "./seen-set.js";
import { shownValue } from "./shown.js";

/**
 * Groups of one `groups:` entry: a 64-bit hash of the key to a dense index (typed arrays, as for keys;
 * fewer memory accesses than a Map of strings), the key text by index for reporting, per-group columns.
 */
interface Groups {
  readonly plan: GroupPlan;
  readonly index: SeenSet;
  readonly keys: string[];
  readonly table: ReturnType<typeof createGroupTable>;
  readonly firstRow: U32List;
  readonly firstLine: U32List;
  lastRow: Uint32Array;
  rows: Uint32Array;
  /** The previous row's key and group: deliveries often list a group's rows together. */
  recentKey: string | undefined;
  recent: number;
}

function grow(a: Uint32Array): Uint32Array {
  const next = new Uint32Array(a.length * 2);
  next.set(a);
  return next;
}

/** Cell states the engine passes along: 0 parsed, 1 blank, 2 not of its type, 3 column absent. */
export type CellStates = Uint8Array;

/**
 * The checks that can only be judged once the whole file is read: groups, outliers and totals.
 * They keep per group one accumulator, per outlier column 12 bytes a row, and per row 4 bytes of
 * line number (only when groups or outliers need to point back at rows).
 */
export function createFileEnd(plan: Plan, out: Collector) {
  const groups: Groups[] = plan.groups.map((g) => ({
    plan: g,
    index: createSeenSet(1 << 11),
    keys: [],
    table: createGroupTable(g.assert.aggregates),
    firstRow: createU32List(),
    firstLine: createU32List(),
    lastRow: new Uint32Array(1024),
    rows: new Uint32Array(1024),
    recentKey: undefined,
    recent: 0,
  }));
  const numbers = plan.outliers.map(() => createFloatColumn());
  const lines = plan.outliers.length > 0 ? createU32List() : undefined;
  const blanks = new Float64Array(plan.columns.length);
  let checked = 0;

  const hasher = createRowHasher();
  // Groups form on typed values, as SQL GROUP BY over typed columns and as keys compare (`01001` and
  // `1001` in an integer column are one employee). Several parts join length-prefixed, so no cell
  // text can make two different keys join alike.
  const parts: string[] = [];
  const groupKey = (g: GroupPlan, values: readonly Value[], texts: readonly string[], states: CellStates): string => {
    parts.length = g.by.length;
    for (let i = 0; i < g.by.length; i++) {
      const c = g.by[i] as number;
      parts[i] = keyPart(values[c] as Value, texts[c] as string, states[c] as number);
    }
    return g.by.length === 1 ? (parts[0] as string) : joinParts(parts);
  };
  // What a group shows: its first row's trimmed texts (masked only when reported); "" for a NULL part.
  const shownPart = (c: number, texts: readonly string[], states: CellStates): string => (states[c] === 0 ? (texts[c] as string) : "");
  const shownKey = (g: GroupPlan, texts: readonly string[], states: CellStates): string =>
    g.by.length === 1 ? shownPart(g.by[0] as number, texts, states) : joinParts(g.by.map((c) => shownPart(c, texts, states)));

  return {
    /** A record not checked (wrong width): only its line is remembered. */
    skipped(line: number) {
      lines?.push(line);
    },
    row(values: readonly Value[], texts: readonly string[], raws: readonly string[], states: CellStates, rowNo: number, line: number) {
      checked++;
      lines?.push(line);
      for (const b of plan.blankShares) if (states[b.column] === 1) blanks[b.column] = (blanks[b.column] ?? 0) + 1;
      for (let o = 0; o < plan.outliers.length; o++) {
        const v = values[(plan.outliers[o] as (typeof plan.outliers)[number]).column];
        if (typeof v === "number") numbers[o]?.push(v, rowNo);
      }
      for (const g of groups) {
        if (g.plan.when !== undefined && !isTrue(g.plan.when.evaluate(values))) continue;
        const key = groupKey(g.plan, values, texts, states);
        let at = g.recent;
        if (key !== g.recentKey) {
          hasher.reset();
          for (const part of parts) hasher.add(part);
          const known = g.index.firstOrAdd(hasher.hi, hasher.lo, g.keys.length + 1);
          if (known !== 0) at = known - 1;
          else {
            at = g.keys.length;
            g.keys.push(shownKey(g.plan, texts, states));
            g.firstRow.push(rowNo);
            g.firstLine.push(line);
            if (at >= g.rows.length) {
              g.rows = grow(g.rows);
              g.lastRow = grow(g.lastRow);
            }
          }
        }
        g.recentKey = key;
        g.recent = at;
        g.table.add(at, values);
        g.lastRow[at] = rowNo;
        g.rows[at] = (g.rows[at] ?? 0) + 1;
      }
    },
    finish(rows: number) {
      const rule = (check: number) => plan.checks[check]?.rule ?? "";
      const level = (check: number) => plan.checks[check]?.level ?? "error";
      for (const g of groups) {
        const names = g.plan.by.map((c) => plan.columns[c]?.name ?? "");
        const failing: number[] = [];
        // Group indexes follow each group's first row, so this is file order.
        for (let at = 0; at < g.keys.length; at++) if (isFalse(g.plan.assert.evaluate(g.table.results(at)))) failing.push(at);
        for (const at of failing) out.cover(g.plan.check, g.rows[at] ?? 0);
        for (const at of failing) {
          const firstRow = g.firstRow.at(at);
          if (!out.fail(g.plan.check, firstRow)) continue;
          const results = g.table.results(at);
          const texts = g.plan.by.length === 1 ? [g.keys[at] ?? ""] : splitParts(g.keys[at] ?? "");
          const key = names
            .map((nm, i) => `${nm}=${texts[i] === "" ? "NULL" : shownValue(texts[i] ?? "", plan.columns[g.plan.by[i] ?? 0]?.sensitive === true)}`)
            .join(", ");
          // An aggregate over a sensitive column (its first, min, max, even a one-row sum) is that column's value.
          const shown = g.plan.assert.aggregates
            .map((a, i) => {
              const v = results[i] ?? null;
              const sensitive = a.arg?.columns.some((c) => plan.columns[c]?.sensitive === true) === true;
              return `${a.fn}(${a.arg?.source ?? ""})=${v === null ? "NULL" : shownValue(formatValue(v), sensitive)}`;
            })
            .join(", ");
          const count = g.rows[at] ?? 0;
          const span = count === 1 ? `row ${firstRow}` : `${count} rows, rows ${firstRow} to ${g.lastRow[at]}`;
          out.keep(g.plan.check, {
            rule: rule(g.plan.check), level: level(g.plan.check), row: firstRow, line: g.firstLine.at(at), column: names[0] ?? "",
            value: key, expected: g.plan.assert.source,
            message: `group ${key} (${span}): ${g.plan.message ?? `${g.plan.assert.source} is false`} (${shown})`,
          });
        }
      }
      plan.outliers.forEach((o, i) => {
        const col = numbers[i];
        if (!col) return;
        const found = findOutliers(col, { method: o.method, k: o.k, threshold: o.threshold });
        const name = plan.columns[o.column]?.name ?? "";
        const sensitive = plan.columns[o.column]?.sensitive === true;
        // Fences and a median come from the column's values (a median can be one of them): masked with it.
        const stat = (x: number) => shownValue(formatValue(x), sensitive);
        const expected = found.fence
          ? `between ${stat(found.fence.low)} and ${stat(found.fence.high)} (Tukey fences, k = ${o.k})`
          : `modified z-score at most ${o.threshold} (median ${stat(found.median ?? 0)}, scaled by ${found.basis === "mean-ad" ? "the mean absolute deviation, as the MAD is 0" : "the MAD"})`;
        for (const hit of found.outliers) {
          if (!out.fail(o.check, hit.row)) continue;
          const shown = shownValue(formatValue(hit.value), sensitive);
          const why = found.fence
            ? `lies outside the Tukey fences ${stat(found.fence.low)} to ${stat(found.fence.high)} (k = ${o.k})`
            : `has modified z-score ${(hit.score ?? 0).toFixed(2)}, beyond ±${o.threshold} (median ${stat(found.median ?? 0)})`;
          out.keep(o.check, { rule: rule(o.check), level: level(o.check), row: hit.row, line: lines?.at(hit.row - 1) ?? 0, column: name, value: shown, expected, message: `${name} ${shown} ${why}` });
        }
      });
      const t = plan.totalRows;
      if (t && ((t.min !== undefined && rows < t.min) || (t.max !== undefined && rows > t.max))) {
        const expected = `between ${t.min ?? 0} and ${t.max ?? "any number of"} rows`;
        if (out.fail(t.check, 0)) out.keep(t.check, { rule: rule(t.check), level: level(t.check), value: String(rows), expected, message: `the file has ${rows} rows; expected ${expected}` });
      }
      for (const b of plan.blankShares) {
        const share = checked === 0 ? 0 : (blanks[b.column] ?? 0) / checked;
        if (share <= b.max) continue;
        const name = plan.columns[b.column]?.name ?? "";
        const pct = (x: number) => `${Number((x * 100).toFixed(2))}%`;
        if (out.fail(b.check, 0)) out.keep(b.check, { rule: rule(b.check), level: level(b.check), column: name, value: pct(share), expected: `at most ${pct(b.max)} blank`, message: `${name} is blank in ${pct(share)} of rows (${blanks[b.column]} of ${checked}); at most ${pct(b.max)} allowed` });
      }
    },
  };
}
