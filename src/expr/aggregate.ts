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
  // Each call gets a place only in the columns its function needs: counts for count and sum, sums and
  // scales for sum, values for min, max and first. A group costs nothing for columns no call uses.
  const countAt: number[] = [];
  const sumAt: number[] = [];
  const valueAt: number[] = [];
  let nCounts = 0;
  let nSums = 0;
  let nValues = 0;
  for (const call of calls) {
    const counted = call.arg === null || call.fn === "count" || call.fn === "sum";
    countAt.push(counted ? nCounts++ : -1);
    sumAt.push(call.arg !== null && call.fn === "sum" ? nSums++ : -1);
    valueAt.push(call.arg !== null && (call.fn === "min" || call.fn === "max" || call.fn === "first") ? nValues++ : -1);
  }
  // Columns for groups 0..started.length-1, all grown together.
  let counts = new Uint32Array(16 * nCounts);
  let sums = new Float64Array(16 * nSums);
  // Largest decimal scale seen per sum (-1: some addend was not a short decimal), so the total is exact.
  let scales = new Int8Array(16 * nSums);
  let started = new Uint8Array(16);
  const values: Value[] = [];
  return {
    add(group, row) {
      if (group >= started.length) {
        const groups = Math.max(group + 1, started.length * 2);
        counts = grown(counts, groups * nCounts, (k) => new Uint32Array(k));
        sums = grown(sums, groups * nSums, (k) => new Float64Array(k));
        scales = grown(scales, groups * nSums, (k) => new Int8Array(k));
        started = grown(started, groups, (k) => new Uint8Array(k));
      }
      const first = started[group] === 0;
      if (first) {
        started[group] = 1;
        for (let i = 0; i < nValues; i++) values[group * nValues + i] = null;
      }
      for (let i = 0; i < calls.length; i++) {
        const call = calls[i] as AggregateCall;
        const c = group * nCounts + (countAt[i] as number);
        if (call.arg === null) {
          counts[c] = (counts[c] as number) + 1;
          continue;
        }
        const v = call.arg.evaluate(row);
        const at = group * nValues + (valueAt[i] as number);
        if (call.fn === "first") {
          if (first) values[at] = v;
          continue;
        }
        if (v === null) continue;
        switch (call.fn) {
          case "count":
            counts[c] = (counts[c] as number) + 1;
            break;
          case "sum": {
            const x = valueToNumber(v);
            if (x === null) break;
            const m = group * nSums + (sumAt[i] as number);
            const s = scales[m] as number;
            if (s >= 0) {
              const sx = scaleOf(x);
              scales[m] = sx < 0 ? -1 : Math.max(s, sx);
            }
            sums[m] = (counts[c] === 0 ? 0 : (sums[m] as number)) + x;
            counts[c] = (counts[c] as number) + 1;
            break;
          }
          case "min":
          case "max": {
            const prev = values[at] as Value;
            const cmp = prev === null ? null : compareValues(v, prev);
            if (prev === null || (cmp !== null && (call.fn === "min" ? cmp < 0 : cmp > 0))) values[at] = v;
            break;
          }
        }
      }
    },
    results(group) {
      const out: Value[] = new Array<Value>(calls.length);
      for (let i = 0; i < calls.length; i++) {
        const call = calls[i] as AggregateCall;
        const c = group * nCounts + (countAt[i] as number);
        if (call.fn === "count") out[i] = counts[c] ?? 0;
        else if (call.fn === "sum") {
          const m = group * nSums + (sumAt[i] as number);
          out[i] = (counts[c] ?? 0) === 0 ? null : snap(sums[m] as number, scales[m] as number);
        } else out[i] = values[group * nValues + (valueAt[i] as number)] ?? null;
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
