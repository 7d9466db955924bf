/**
 * Accumulates the aggregate calls of a group assert over the group's rows, as SQL aggregates do:
 * sum, min and max skip NULL and give NULL when no value remains; count() counts rows, count(x) the
 * non-NULL x; first(x) is x on the group's first row, NULL included (like FIRST_VALUE).
 */
import type { Value } from "../values.js";
import { compareValues } from "./compare.js";
import { scaleOf, snap } from "./decimal.js";
import { valueToNumber } from "./coerce.js";
import type { AggregateCall } from "./types.js";

/** Accumulator for a group's aggregate calls: add each row of the group, read results at the end. */
export function createAccumulator(calls: readonly AggregateCall[]): { add(row: readonly Value[]): void; results(): Value[] } {
  const n = calls.length;
  const values: Value[] = new Array<Value>(n).fill(null);
  const counts: number[] = new Array<number>(n).fill(0);
  // Largest decimal scale seen per sum (-1: some addend was not a short decimal), so the total is exact.
  const scales: number[] = new Array<number>(n).fill(0);
  let rows = 0;
  return {
    add(row) {
      for (let i = 0; i < n; i++) {
        const call = calls[i] as AggregateCall;
        if (call.arg === null) {
          counts[i] = (counts[i] as number) + 1;
          continue;
        }
        const v = call.arg.evaluate(row);
        if (call.fn === "first") {
          if (rows === 0) values[i] = v;
          continue;
        }
        if (v === null) continue;
        switch (call.fn) {
          case "count":
            counts[i] = (counts[i] as number) + 1;
            break;
          case "sum": {
            const x = valueToNumber(v);
            if (x === null) break;
            const s = scales[i] as number;
            if (s >= 0) {
              const sx = scaleOf(x);
              scales[i] = sx < 0 ? -1 : Math.max(s, sx);
            }
            const prev = values[i];
            values[i] = typeof prev === "number" ? prev + x : x;
            break;
          }
          case "min":
          case "max": {
            const prev = values[i] as Value;
            const c = prev === null ? null : compareValues(v, prev);
            if (prev === null || (c !== null && (call.fn === "min" ? c < 0 : c > 0))) values[i] = v;
            break;
          }
        }
      }
      rows++;
    },
    results() {
      const out: Value[] = new Array<Value>(n);
      for (let i = 0; i < n; i++) {
        const call = calls[i] as AggregateCall;
        const v = values[i] as Value;
        if (call.fn === "count") out[i] = counts[i] as number;
        else if (call.fn === "sum" && typeof v === "number") out[i] = snap(v, scales[i] as number);
        else out[i] = v;
      }
      return out;
    },
  };
}
