import type { ColumnType } from "../contract/types.js";
import { dateValue, timestampValue, timeValue, type TimestampValue, type Value } from "../values.js";
import { ZONED } from "./prepare.js";

/** A parsed cell's Value from what PreparedRows holds: its text, its number and its state's flags. */
export type RebuildValue = (column: number, text: string, x: number, flags: number) => Value;

/**
 * Turns prepared numbers back into values, column by column. The last date, time or timestamp each
 * column rebuilt is kept with the number it came from: deliveries repeat themselves from row to row,
 * and values are immutable, so one object serves a run of equal cells.
 */
export function createValueRebuilder(kinds: readonly ColumnType[]): RebuildValue {
  const lastNumber = new Float64Array(kinds.length).fill(Number.NaN);
  const lastValue: Value[] = new Array<Value>(kinds.length).fill(null);
  return (i, text, x, flags) => {
    const kind = kinds[i];
    if (kind === "text") return text;
    if (kind === "integer" || kind === "decimal") return x;
    if (kind === "boolean") return x !== 0;
    const zoned = (flags & ZONED) !== 0;
    const last = lastValue[i] as Value;
    if (lastNumber[i] === x && (kind !== "timestamp" || (last as TimestampValue).zoned === zoned)) return last;
    const v = kind === "date" ? dateValue(x) : kind === "time" ? timeValue(x) : timestampValue(x, zoned);
    lastNumber[i] = x;
    lastValue[i] = v;
    return v;
  };
}
