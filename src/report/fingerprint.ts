import { createHash } from "node:crypto";
import type { DeliveryReport, Finding } from "./model.js";

/**
 * A stable identity for each finding of a report, independent of line and row numbers so that an
 * unchanged problem keeps its identity when rows are inserted above it:
 * sha256 of (contract name, delivery path, rule, column, value, n) where n counts earlier findings of
 * the report with the same rule, column and value. Unique within a report; `value` is already masked
 * for sensitive columns, so nothing sensitive goes into the hash.
 */
export function fingerprints(report: DeliveryReport): readonly string[] {
  const seen = new Map<string, number>();
  return report.findings.map((f: Finding) => {
    const key = [f.rule, f.column ?? "", f.value ?? ""].join("\u0000");
    const n = seen.get(key) ?? 0;
    seen.set(key, n + 1);
    return createHash("sha256")
      .update([report.contract.name, report.input.path, key, String(n)].join("\u0000"))
      .digest("hex");
  });
}
