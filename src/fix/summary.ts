import { REPAIR_NAMES } from "./cell-repair.js";
import type { Count, FixOutcome } from "./fix-file.js";
import type { FixTargets } from "./targets.js";

const list = (counts: readonly Count[]): string => counts.map((c) => `${c.name} ${c.count}`).join(", ");

/**
 * The run in a few lines for stderr: rows read, kept and rejected, cells repaired by repair, rejected
 * rows by rule, masked log entries, and whether the clean file meets the contract. No cell values.
 */
export function fixSummary(outcome: FixOutcome, input: string, contract: string, targets: FixTargets): string {
  const o = outcome;
  const lines = [`tablegate fix: ${input} against ${contract}`];
  lines.push(`  rows read: ${o.rows}`);
  lines.push(`  rows clean: ${o.cleanRows} -> ${targets.out}`);
  lines.push(`  rows rejected: ${o.rejectedRows} -> ${targets.rejects}${o.rejectedRows > 0 ? ` (by rule: ${list(o.rejectedByRule)})` : ""}`);
  const byRepair = REPAIR_NAMES.filter((r) => o.repairs[r] > 0).map((r) => `${r} ${o.repairs[r]}`).join(", ");
  lines.push(`  cells repaired: ${o.changedCells}${byRepair === "" ? "" : ` (${byRepair})`} -> ${targets.log}`);
  if (o.maskedColumns.length > 0) {
    lines.push(`  sensitive cells repaired: ${list(o.maskedColumns)}; their before and after are masked in the log`);
  }
  if (o.encoding !== "utf-8") lines.push(`  the delivery was read as ${o.encoding}; the files written are UTF-8`);
  if (o.cleanVerdict === "pass") lines.push("  clean file meets the contract");
  else {
    lines.push(`  clean file does not meet the contract: ${list(o.cleanFailures)}`);
    lines.push("  (header, group, outlier and totals checks judge the file as a whole and reject no single row)");
  }
  return `${lines.join("\n")}\n`;
}
