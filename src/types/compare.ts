import type { Value } from "../values.js";

const sign = (d: number): number => (d < 0 ? -1 : d > 0 ? 1 : 0);

// Mixed kinds should not meet; if they do, a fixed kind order keeps sorting total and deterministic.
function rank(v: Value): number {
  if (v === null) return 0;
  switch (typeof v) {
    case "boolean":
      return 1;
    case "number":
      return 2;
    case "string":
      return 3;
  }
  return v.kind === "date" ? 4 : v.kind === "timestamp" ? 5 : 6;
}

/**
 * Order two values of the same kind: negative, 0 or positive. Numbers by value, false before true,
 * dates by day, timestamps by instant (unzoned ones read as UTC), times by seconds, strings by UTF-16 code unit.
 */
export function compareValues(a: Value, b: Value): number {
  if (typeof a === "number" && typeof b === "number") return sign(a - b);
  if (typeof a === "string" && typeof b === "string") return a < b ? -1 : a > b ? 1 : 0;
  if (typeof a === "boolean" && typeof b === "boolean") return Number(a) - Number(b);
  if (a !== null && b !== null && typeof a === "object" && typeof b === "object") {
    if (a.kind === "date" && b.kind === "date") return sign(a.days - b.days);
    if (a.kind === "timestamp" && b.kind === "timestamp") return sign(a.ms - b.ms);
    if (a.kind === "time" && b.kind === "time") return sign(a.seconds - b.seconds);
  }
  return sign(rank(a) - rank(b));
}
