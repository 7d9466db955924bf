import type { DeliveryReport, Finding, Level } from "./model.js";
import type { WriterContext } from "./writer.js";
import { findingLine, levelRank } from "./tally.js";
import { plural, whereText } from "./wording.js";
import { workflowCommand } from "./workflow-command.js";

/** GitHub shows at most this many annotations of each kind per step (GitHub Actions documentation). */
export const ANNOTATIONS_PER_LEVEL = 10;

const COMMAND: Readonly<Record<Level, string>> = { error: "error", warning: "warning", note: "notice" };

function message(report: DeliveryReport, f: Finding): string {
  const value = f.value === undefined ? "" : `, value ${JSON.stringify(f.value)}`;
  const expected = f.expected === undefined ? "" : `, expected ${f.expected}`;
  return `${f.message} (${report.contract.name}: ${whereText(f)}${value}${expected})`;
}

/**
 * GitHub Actions annotations for stdout: findings most severe first, at most ANNOTATIONS_PER_LEVEL
 * per kind (one notice slot is kept for the totals), then one notice with the totals and how many
 * were not annotated. Empty when no delivery has findings.
 */
export function githubAnnotations(reports: readonly DeliveryReport[], _ctx: WriterContext): string {
  const all = reports.flatMap((report) => report.findings.map((f, order) => ({ report, f, order })));
  const sorted = all
    .map((x, i) => ({ ...x, i }))
    .sort((a, b) => levelRank(a.f.level) - levelRank(b.f.level) || a.i - b.i);
  const room: Record<Level, number> = { error: ANNOTATIONS_PER_LEVEL, warning: ANNOTATIONS_PER_LEVEL, note: ANNOTATIONS_PER_LEVEL - 1 };
  const lines: string[] = [];
  for (const { report, f } of sorted) {
    if (room[f.level] === 0) continue;
    room[f.level] -= 1;
    lines.push(workflowCommand(COMMAND[f.level], [["file", report.input.path], ["line", findingLine(f)], ["title", f.rule]], message(report, f)));
  }
  const exact = reports.reduce((n, r) => n + r.counts.error + r.counts.warning + r.counts.note, 0);
  if (exact === 0 && all.length === 0) return "";
  const total = Math.max(exact, all.length);
  const errors = reports.reduce((n, r) => n + r.counts.error, 0);
  const warnings = reports.reduce((n, r) => n + r.counts.warning, 0);
  const notes = reports.reduce((n, r) => n + r.counts.note, 0);
  const failed = reports.filter((r) => r.verdict === "fail").length;
  const more = total - lines.length;
  const summary =
    `tablegate: ${plural(failed, "delivery", "deliveries")} of ${reports.length} failed; ` +
    `${plural(total, "finding")} (${plural(errors, "error")}, ${plural(warnings, "warning")}, ${plural(notes, "note")})` +
    (more > 0 ? `; and ${plural(more, "more finding")} not annotated; see the report` : "");
  lines.push(workflowCommand("notice", [["title", "tablegate totals"]], summary));
  return `${lines.join("\n")}\n`;
}
