import type { Value } from "../values.js";

/** A key part as keys compare it: typed values by what they mean (`01` = `1`, `1.50` = `1.5`), text as written. */
export function keyText(v: Value, text: string): string {
  if (typeof v === "string") return text;
  if (typeof v === "number" || typeof v === "boolean") return String(v);
  if (v === null) return "";
  return v.kind === "date" ? `d${v.days}` : v.kind === "timestamp" ? `t${v.ms}` : `s${v.seconds}`;
}
