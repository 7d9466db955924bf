import { mask } from "../report/mask.js";
import type { CellChange } from "./row-repair.js";

/**
 * One NDJSON line for a changed cell. A sensitive column's before and after are masked (and the
 * line says so): the log tells that and how a value changed, never the value.
 */
export function changeLine(row: number, line: number, column: string, change: CellChange, sensitive: boolean): string {
  const entry = {
    row,
    line,
    column,
    repair: change.repairs.join("+"),
    before: sensitive ? mask(change.before) : change.before,
    after: sensitive ? mask(change.after) : change.after,
    ...(sensitive ? { masked: true } : {}),
  };
  return `${JSON.stringify(entry)}\n`;
}

/** One NDJSON line for a record sent to the rejects file, with the error-level rules it still fails. */
export function rejectLine(row: number, line: number, rules: readonly string[]): string {
  return `${JSON.stringify({ row, line, rejected: true, rules })}\n`;
}
