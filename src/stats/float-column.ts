/** The read side of a numeric column: what the outlier statistics need. */
export interface FloatColumnView {
  readonly length: number;
  /** The stored values, a view (not a copy) of length `length`. */
  values(): Float64Array;
  /** The row number of each stored value, a view of length `length`. */
  rows(): Uint32Array;
}

/** An append-only numeric column; `push` skips non-finite values so statistics never see NaN or ±Infinity. */
export interface FloatColumn extends FloatColumnView {
  push(value: number, row: number): void;
}

const DEFAULT_CAPACITY = 1024;

/**
 * An append-only numeric column in a growable Float64Array, with the row number of each value in a
 * Uint32Array (capacity doubles when full): about 12 bytes per value, plus up to as much again of slack.
 */
export function createFloatColumn(initialCapacity: number = DEFAULT_CAPACITY): FloatColumn {
  let capacity = Number.isInteger(initialCapacity) && initialCapacity > 0 ? initialCapacity : DEFAULT_CAPACITY;
  let values = new Float64Array(capacity);
  let rows = new Uint32Array(capacity);
  let length = 0;

  function grow(): void {
    capacity *= 2;
    const nextValues = new Float64Array(capacity);
    nextValues.set(values);
    values = nextValues;
    const nextRows = new Uint32Array(capacity);
    nextRows.set(rows);
    rows = nextRows;
  }

  return {
    push(value: number, row: number): void {
      if (!Number.isFinite(value)) return;
      if (length === capacity) grow();
      values[length] = value;
      rows[length] = row;
      length++;
    },
    get length(): number {
      return length;
    },
    values: () => values.subarray(0, length),
    rows: () => rows.subarray(0, length),
  };
}
