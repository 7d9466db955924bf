import type { Plan } from "../contract/plan.js";
import type { ColumnProfile } from "../report/model.js";
import { compareValues, formatValue } from "../types/index.js";
import type { Value } from "../values.js";

/** Distinct values are counted exactly up to this many per column, then reported as "at least". */
const DISTINCT_CAP = 10_000;
/** Numeric and date columns keep a uniform sample of this many values for the histogram. */
const SAMPLE = 4096;
const BINS = 12;

interface ColumnStats {
  filled: number;
  blank: number;
  readonly distinct: Set<string>;
  capped: boolean;
  min: Value;
  max: Value;
  readonly sample: Float64Array;
  seen: number;
}

const numberOf = (v: Value): number | undefined =>
  typeof v === "number" ? v : v !== null && typeof v === "object" ? (v.kind === "date" ? v.days : v.kind === "timestamp" ? v.ms : v.seconds) : undefined;

/**
 * A per-column summary for people (the HTML report): blanks, distinct values (exact up to a cap), min
 * and max, and a histogram drawn from a fixed-size uniform sample (reservoir sampling with a seeded
 * generator, so the same file gives the same picture). Memory is bounded per column, whatever the rows.
 */
export function createProfiler(plan: Plan) {
  const stats: ColumnStats[] = plan.columns.map(() => ({ filled: 0, blank: 0, distinct: new Set(), capped: false, min: null, max: null, sample: new Float64Array(SAMPLE), seen: 0 }));
  let seed = 0x2545f491;
  const random = () => {
    seed ^= seed << 13;
    seed ^= seed >>> 17;
    seed ^= seed << 5;
    return (seed >>> 0) / 4294967296;
  };
  return {
    /** `states`: 0 parsed, 1 blank, 2 not of its type, 3 absent. */
    row(values: readonly Value[], texts: readonly string[], states: Uint8Array) {
      for (let i = 0; i < stats.length; i++) {
        const s = stats[i] as ColumnStats;
        const st = states[i];
        if (st === 3) continue;
        if (st === 1) {
          s.blank++;
          continue;
        }
        s.filled++;
        if (!s.capped) {
          s.distinct.add(texts[i] as string);
          if (s.distinct.size > DISTINCT_CAP) s.capped = true;
        }
        const v = values[i] ?? null;
        if (st !== 0 || v === null) continue;
        if (s.min === null || compareValues(v, s.min) < 0) s.min = v;
        if (s.max === null || compareValues(v, s.max) > 0) s.max = v;
        const x = numberOf(v);
        if (x === undefined) continue;
        if (s.seen < SAMPLE) s.sample[s.seen] = x;
        else {
          const j = Math.floor(random() * (s.seen + 1));
          if (j < SAMPLE) s.sample[j] = x;
        }
        s.seen++;
      }
    },
    result(): ColumnProfile[] {
      return plan.columns.map((col, i) => {
        const s = stats[i] as ColumnStats;
        const sensitive = col.sensitive;
        const base: ColumnProfile = {
          column: col.name,
          type: col.type,
          filled: s.filled,
          blank: s.blank,
          distinct: Math.min(s.distinct.size, DISTINCT_CAP),
          distinct_capped: s.capped,
          ...(sensitive || s.min === null ? {} : { min: formatValue(s.min) }),
          ...(sensitive || s.max === null ? {} : { max: formatValue(s.max) }),
        };
        const lo = numberOf(s.min);
        const hi = numberOf(s.max);
        if (sensitive || lo === undefined || hi === undefined || s.seen === 0) return base;
        const n = Math.min(s.seen, SAMPLE);
        const bins = new Array<number>(BINS).fill(0);
        const width = (hi - lo) / BINS;
        for (let k = 0; k < n; k++) {
          const x = s.sample[k] as number;
          const b = width === 0 ? 0 : Math.min(BINS - 1, Math.floor((x - lo) / width));
          bins[b] = (bins[b] ?? 0) + 1;
        }
        return { ...base, histogram: bins };
      });
    },
  };
}
