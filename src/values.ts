/** A calendar date, as whole days since 1970-01-01 (negative before). */
export interface DateValue {
  readonly kind: "date";
  readonly days: number;
}

/** An instant, as milliseconds since 1970-01-01T00:00:00Z; `zoned` tells whether the text carried an offset. */
export interface TimestampValue {
  readonly kind: "timestamp";
  readonly ms: number;
  readonly zoned: boolean;
}

/** A time of day, as seconds since midnight. */
export interface TimeValue {
  readonly kind: "time";
  readonly seconds: number;
}

/**
 * A cell after parsing by its column type. `null` is SQL NULL: a blank cell, or one that failed to
 * parse as its type. Text stays a string, integer and decimal become numbers, boolean a boolean.
 */
export type Value = string | number | boolean | DateValue | TimestampValue | TimeValue | null;

export const dateValue = (days: number): DateValue => ({ kind: "date", days });
export const timestampValue = (ms: number, zoned: boolean): TimestampValue => ({ kind: "timestamp", ms, zoned });
export const timeValue = (seconds: number): TimeValue => ({ kind: "time", seconds });
