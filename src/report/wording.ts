import type { Finding } from "./model.js";

/** An integer with comma thousands separators, independent of the machine's locale. */
export function formatCount(n: number): string {
  const s = String(Math.trunc(Math.abs(n)));
  const grouped = s.replace(/\B(?=(\d{3})+$)/g, ",");
  return n < 0 ? `-${grouped}` : grouped;
}

/** "1 problem", "12 problems". */
export const plural = (n: number, one: string, many = `${one}s`): string => `${formatCount(n)} ${n === 1 ? one : many}`;

/** Where a finding is, in words: "row 17 (line 18), column discount", or "whole file". */
export function whereText(f: Finding): string {
  const parts: string[] = [];
  if (f.row !== undefined) parts.push(f.line !== undefined && f.line !== f.row ? `row ${f.row} (line ${f.line})` : `row ${f.row}`);
  else if (f.line !== undefined) parts.push(`line ${f.line}`);
  if (f.column !== undefined) parts.push(`column ${f.column}`);
  return parts.length === 0 ? "whole file" : parts.join(", ");
}
