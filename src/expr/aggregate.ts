/**
 * Accumulates the aggregate calls of a group assert over the rows of many groups at once, as SQL
 * aggregates do: sum, min and max skip NULL and give NULL when no value remains; count() counts rows,
 * count(x) the non-NULL x; first(x) is x on the group's first row, NULL included (like FIRST_VALUE).
 * State lives in columns indexed by group (typed arrays for counts, sums and scales), so a file with a
 * million small groups costs tens of bytes per group, not an object graph per group.
 */
import type { Value } from "../values.js";
import { compareValues } from "./compare.js";
import { scaleOf, snap } from "./decimal.js";
import { valueToNumber } from "./coerce.js";
import type { AggregateCall } from "./types.js";

/** Aggregate state for any number of groups, addressed by a dense group index from 0. */
export interface GroupTable {
  /** Add one row to group `group` (groups are created by adding to the next unused index). */
  add(group: number, row: readonly Value[]): void;
  /** The aggregate results of a group, in the order of the calls. */
  results(group: number): Value[];
}

function grown<T extends Float64Array | Uint32Array | Int8Array | Uint8Array>(a: T, need: number, make: (n: number) => T): T {
  if (need <= a.length) return a;
  const next = make(Math.max(need, a.length * 2));
  next.set(a);
  return next;
}

export function createGroupTable(calls: readonly AggregateCall[]): GroupTable {
  const n = calls.length;
  // Arrays for groups 0..started.length-1, all grown together.
  let counts = new Uint32Array(16 * n);
  let sums = new Float64Array(16 * n);
  // Largest decimal scale seen per sum (-1: some addend was not a short decimal), so the total is exact.
  let scales = new Int8Array(16 * n);
  let started = new Uint8Array(16);
  const values: Value[] = [];
  return {
    add(group, row) {
      const base = group * n;
      if (group >= started.length) {
        counts = grown(counts, base + n, (k) => new Uint32Array(k));
        sums = grown(sums, base + n, (k) => new Float64Array(k));
        scales = grown(scales, base + n, (k) => new Int8Array(k));
        started = grown(started, group + 1, (k) => new Uint8Array(k));
      }
      const first = started[group] === 0;
      if (first) {
        started[group] = 1;
        for (let i = 0; i < n; i++) values[base + i] = null;
      }
      for (let i = 0; i < n; i++) {
        const call = calls[i] as AggregateCall;
        const at = base + i;
        if (call.arg === null) {
          counts[at] = (counts[at] as number) + 1;
          continue;
        }
        const v = call.arg.evaluate(row);
        if (call.fn === "first") {
          if (first) values[at] = v;
          continue;
        }
        if (v === null) continue;
        switch (call.fn) {
          case "count":
            counts[at] = (counts[at] as number) + 1;
            break;
          case "sum": {
            const x = valueToNumber(v);
            if (x === null) break;
            const s = scales[at] as number;
            if (s >= 0) {
              const sx = scaleOf(x);
              scales[at] = sx < 0 ? -1 : Math.max(s, sx);
            }
            sums[at] = (counts[at] === 0 ? 0 : (sums[at] as number)) + x;
            counts[at] = (counts[at] as number) + 1;
            break;
          }
          case "min":
          case "max": {
            const prev = values[at] as Value;
            const c = prev === null ? null : compareValues(v, prev);
            if (prev === null || (c !== null && (call.fn === "min" ? c < 0 : c > 0))) values[at] = v;
            break;
          }
        }
      }
    },
    results(group) {
      const base = group * n;
      const out: Value[] = new Array<Value>(n);
      for (let i = 0; i < n; i++) {
        const call = calls[i] as AggregateCall;
        const at = base + i;
        if (call.fn === "count") out[i] = counts[at] ?? 0;
        else if (call.fn === "sum") out[i] = (counts[at] ?? 0) === 0 ? null : snap(sums[at] as number, scales[at] as number);
        else out[i] = values[at] ?? null;
      }
      return out;
    },
  };
}

/** Accumulator for one group's aggregate calls: add each row of the group, read results at the end. */
export function createAccumulator(calls: readonly AggregateCall[]): { add(row: readonly Value[]): void; results(): Value[] } {
  const table = createGroupTable(calls);
  return { add: (row) => table.add(0, row), results: () => table.results(0) };
}
