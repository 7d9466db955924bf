import type { DeliveryOutcome } from "./expected.js";

interface Tally { readonly failed: number; readonly rows: number[] }

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

/** Failures per rule from a parsed JSON report: `checks[].failed` and the rows of `findings`. */
function tallies(report: Record<string, unknown>): Map<string, Tally> {
  const out = new Map<string, Tally>();
  const checks = Array.isArray(report["checks"]) ? (report["checks"] as unknown[]) : [];
  for (const c of checks) {
    if (isRecord(c) && typeof c["rule"] === "string" && typeof c["failed"] === "number" && c["failed"] > 0) {
      out.set(c["rule"], { failed: c["failed"], rows: [] });
    }
  }
  const findings = Array.isArray(report["findings"]) ? (report["findings"] as unknown[]) : [];
  for (const f of findings) {
    if (!isRecord(f) || typeof f["rule"] !== "string" || typeof f["row"] !== "number") continue;
    out.get(f["rule"])?.rows.push(f["row"]);
  }
  return out;
}

function sameRows(a: readonly number[], b: readonly number[]): boolean {
  const x = [...a].sort((p, q) => p - q);
  const y = [...b].sort((p, q) => p - q);
  return x.length === y.length && x.every((v, i) => v === y[i]);
}

/** Every way a parsed JSON report differs from the designed outcome; empty when it matches. */
export function compareReport(report: unknown, expect: DeliveryOutcome): string[] {
  if (!isRecord(report)) return ["the JSON report is not an object"];
  const diffs: string[] = [];
  if (report["verdict"] !== expect.verdict) diffs.push(`verdict ${String(report["verdict"])}, expected ${expect.verdict}`);
  const input = report["input"];
  const rows = isRecord(input) ? input["rows"] : undefined;
  if (rows !== expect.rows) diffs.push(`input.rows ${String(rows)}, expected ${expect.rows}`);
  const seen = tallies(report);
  for (const [rule, want] of Object.entries(expect.failures)) {
    const got = seen.get(rule);
    if (got === undefined) {
      diffs.push(`${rule}: not reported (planted: ${want.planted})`);
      continue;
    }
    if (got.failed !== want.failed) diffs.push(`${rule}: ${got.failed} failures, expected ${want.failed}`);
    if (want.rows !== undefined && !sameRows(got.rows, want.rows)) diffs.push(`${rule}: rows ${got.rows.join(", ") || "none"}, expected ${want.rows.join(", ")}`);
  }
  for (const [rule, got] of seen) {
    if (!(rule in expect.failures)) diffs.push(`${rule}: ${got.failed} unexpected failures (rows ${got.rows.join(", ") || "none"})`);
  }
  return diffs;
}

/** Raw values of sensitive cells that appear in an output; `values` are the raw cell texts. */
export function leakedValues(output: string, values: Iterable<string>): string[] {
  const leaks: string[] = [];
  for (const v of values) if (v !== "" && output.includes(v)) leaks.push(v);
  return leaks;
}
