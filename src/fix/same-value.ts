import type { Value } from "../values.js";

/** Whether two parsed cells mean the same: equal numbers, booleans or texts, the same day, instant (and zoning) or time. */
export function sameValue(a: Value, b: Value | undefined): boolean {
  if (b === undefined) return false;
  if (a === null || b === null || typeof a !== "object" || typeof b !== "object") return a === b;
  if (a.kind === "date") return b.kind === "date" && a.days === b.days;
  if (a.kind === "timestamp") return b.kind === "timestamp" && a.ms === b.ms && a.zoned === b.zoned;
  return b.kind === "time" && a.seconds === b.seconds;
}
