import type { CheckTally, DeliveryReport } from "./model.js";
import type { Writer } from "./writer.js";

function checkJson(c: CheckTally): Omit<CheckTally, "examples" | "otherLevels"> {
  const { examples: _examples, otherLevels: _other, ...rest } = c;
  return rest;
}

/** One delivery in the SPEC §4 shape, keys in a fixed order and no timing, so equal inputs give equal bytes. */
export function deliveryJson(r: DeliveryReport): Record<string, unknown> {
  return {
    report: r.report,
    tool: r.tool,
    contract: r.contract,
    input: r.input,
    references: r.references,
    verdict: r.verdict,
    counts: r.counts,
    checks: r.checks.map(checkJson),
    findings: r.findings,
    truncated: r.truncated,
    ...(r.profile === undefined ? {} : { profile: r.profile }),
  };
}

/**
 * The JSON report. One delivery: exactly the SPEC §4 object. Several (a run over many files): an
 * envelope with the overall verdict and counts, and each delivery's object under `deliveries`.
 */
export const json: Writer = (reports, ctx) => {
  const unclaimed = ctx.unclaimed ?? [];
  if (reports.length === 1 && reports[0] && unclaimed.length === 0) return JSON.stringify(deliveryJson(reports[0]), null, 2) + "\n";
  const sum = (k: "error" | "warning" | "note" | "rows_failed") => reports.reduce((n, r) => n + r.counts[k], 0);
  return JSON.stringify({
    report: 1,
    tool: { name: "tablegate", version: ctx.toolVersion },
    verdict: reports.some((r) => r.verdict === "fail") || (ctx.unclaimedFails === true && unclaimed.length > 0) ? "fail" : "pass",
    counts: { error: sum("error"), warning: sum("warning"), note: sum("note"), rows_failed: sum("rows_failed") },
    deliveries: reports.map(deliveryJson),
    ...(unclaimed.length === 0 ? {} : { unclaimed }),
  }, null, 2) + "\n";
};
