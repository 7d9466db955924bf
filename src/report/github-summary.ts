import type { CheckTally, DeliveryReport } from "./model.js";
import type { WriterContext } from "./writer.js";
import { mdCell, mdCode } from "./markdown.js";
import { levelRank, tallies } from "./tally.js";
import { formatCount, plural } from "./wording.js";

/** GitHub keeps at most 1 MiB of step summary per step (GitHub Actions documentation). */
export const STEP_SUMMARY_LIMIT = 1024 * 1024;
/** Findings listed per delivery in the summary. */
export const SUMMARY_FINDINGS_PER_DELIVERY = 50;

// Room kept for the closing note, so the cut summary still fits.
const RESERVE = 1024;

function deliverySection(r: DeliveryReport): string[] {
  const c = r.contract;
  const total = r.counts.error + r.counts.warning + r.counts.note;
  const checks = tallies(r, { byLevel: true });
  const failing = [...checks].filter((t) => t.failed > 0).sort((a, b) => levelRank(a.level) - levelRank(b.level));
  const passed = checks.length - failing.length;
  const out: string[] = [
    `### ${r.verdict === "pass" ? "Pass" : "Fail"}: ${mdCode(r.input.path)}`,
    "",
    `Checked against contract **${mdCell(c.name)}**${c.version === undefined ? "" : ` ${mdCell(c.version)}`} (${mdCode(c.path)}). ` +
      (total === 0
        ? `No problems in ${plural(r.input.rows, "row")}.`
        : `${plural(total, "problem")} in ${formatCount(r.counts.rows_failed)} of ${plural(r.input.rows, "row")}: ` +
          `${plural(r.counts.error, "error")}, ${plural(r.counts.warning, "warning")}, ${plural(r.counts.note, "note")}.`),
    "",
  ];
  if (failing.length > 0) {
    out.push("| Check | Level | Failed | What it demands | Contract line |", "| --- | --- | ---: | --- | ---: |");
    for (const t of failing) out.push(checkRow(t));
    out.push("");
  }
  out.push(`${plural(passed, "other check")} passed.`, "");
  return out;
}

function checkRow(t: CheckTally): string {
  const allowed = t.within_allowance === true ? " (within allowance)" : "";
  return `| ${mdCode(t.rule)} | ${t.level} | ${formatCount(t.failed)}${allowed} | ${mdCell(t.description)} | ${t.source?.line ?? ""} |`;
}

function findingRows(r: DeliveryReport): { head: string[]; rows: string[]; more: number } {
  const shown = r.findings.slice(0, SUMMARY_FINDINGS_PER_DELIVERY);
  const exact = r.counts.error + r.counts.warning + r.counts.note;
  return {
    head: ["| Check | Row | Line | Column | Value | Expected |", "| --- | ---: | ---: | --- | --- | --- |"],
    rows: shown.map(
      (f) =>
        `| ${mdCode(f.rule)} | ${f.row ?? ""} | ${f.line ?? ""} | ${mdCell(f.column ?? "")} | ${mdCell(f.value ?? "")} | ${mdCell(f.expected ?? "")} |`,
    ),
    more: Math.max(exact, r.findings.length) - shown.length,
  };
}

/**
 * The Markdown to append to $GITHUB_STEP_SUMMARY: verdict, per delivery the failing checks with exact
 * counts and their contract lines, then its first findings. Stays under STEP_SUMMARY_LIMIT bytes,
 * cutting tables with a note when it must.
 */
export function githubSummary(reports: readonly DeliveryReport[], _ctx: WriterContext): string {
  const failed = reports.filter((r) => r.verdict === "fail").length;
  const budget = STEP_SUMMARY_LIMIT - RESERVE;
  let size = 0;
  const parts: string[] = [];
  const add = (line: string): boolean => {
    const bytes = Buffer.byteLength(line, "utf8") + 1;
    if (size + bytes > budget) return false;
    size += bytes;
    parts.push(line);
    return true;
  };
  let cut = false;
  const heading = [
    `## tablegate: ${
      reports.length === 0
        ? "no deliveries were checked"
        : failed === 0
          ? "all deliveries meet their contracts"
          : `${plural(failed, "delivery", "deliveries")} of ${reports.length} failed`
    }`,
    "",
  ];
  for (const line of heading) add(line);
  for (const r of reports) {
    if (cut) break;
    for (const line of deliverySection(r)) if (!add(line)) { cut = true; break; }
    if (cut || r.findings.length === 0) continue;
    const { head, rows, more } = findingRows(r);
    for (const line of ["First findings:", "", ...head, ...rows]) if (!add(line)) { cut = true; break; }
    if (cut) break;
    add("");
    if (more > 0) add(`and ${plural(more, "more finding")}; see the full report.`) && add("");
  }
  if (cut) parts.push("", "_Summary cut here to stay under GitHub's 1 MiB step summary limit; the full report has everything._");
  return `${parts.join("\n")}\n`;
}
