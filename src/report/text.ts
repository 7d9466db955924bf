import type { CheckTally, DeliveryReport, Finding, Level } from "./model.js";
import { paint } from "./colour.js";
import { oneLine } from "./one-line.js";
import { tallies } from "./tally.js";
import { thousands } from "./thousands.js";
import type { Writer, WriterContext } from "./writer.js";


const ORDER: Readonly<Record<Level, number>> = { error: 0, warning: 1, note: 2 };
const n = thousands;
const plural = (x: number, word: string) => `${n(x)} ${word}${x === 1 ? "" : "s"}`;

function where(f: Finding): string {
  if (f.row !== undefined) return `row ${f.row}${f.line === undefined ? "" : ` (line ${f.line})`}`;
  return f.line === undefined ? "file" : `line ${f.line}`;
}

function checkBlock(r: DeliveryReport, c: CheckTally, colour: boolean | undefined): string[] {
  const src = c.source ? `${r.contract.path}:${c.source.line}` : "built in";
  const allowance = c.allow === undefined ? "" : ` · ${(100 * (c.share ?? 0)).toFixed(2)}% of rows, ${c.within_allowance ? "within" : "over"} the ${(100 * c.allow).toFixed(2)}% allowed`;
  const lines = [`${paint(colour, c.level, c.level.toUpperCase().padEnd(7))} ${c.rule} · ${plural(c.failed, "finding")}${allowance}`, oneLine(`        ${c.description} (${src})`)];
  const shown = c.examples ?? r.findings.filter((f) => f.rule === c.rule && f.level === c.level).slice(0, 5);
  for (const f of shown) lines.push(oneLine(`        ${where(f).padEnd(22)} ${f.message}${f.value !== undefined && !f.message.includes(f.value) ? ` (value ${f.value})` : ""}`));
  const more = c.failed - shown.length;
  if (more > 0) lines.push(`        ... and ${plural(more, "more finding")} of this rule`);
  return lines;
}

function delivery(r: DeliveryReport, colour: boolean | undefined): string {
  const c = r.counts;
  const head = [
    oneLine(`${r.input.path} · contract ${r.contract.name}${r.contract.version ? ` ${r.contract.version}` : ""} (${r.contract.path})`),
    `${r.verdict === "pass" ? paint(colour, "pass", "PASS") : paint(colour, "fail", "FAIL")} · ${plural(r.input.rows, "row")} · ${plural(c.error, "error")}, ${plural(c.warning, "warning")}, ${plural(c.note, "note")} · ${plural(c.rows_failed, "row")} with errors`,
  ];
  if (r.input.note) head.push(oneLine(`note: ${r.input.note}`));
  const failed = tallies(r, { byLevel: true }).filter((k) => k.failed > 0).sort((a, b) => ORDER[a.level] - ORDER[b.level]);
  const body = failed.flatMap((k) => ["", ...checkBlock(r, k, colour)]);
  const tail = r.truncated ? ["", `(the JSON report lists the first ${n(r.findings.length)} findings; counts above are complete)`] : [];
  return [...head, ...body, ...tail].join("\n");
}

/** The report for people reading a terminal or a CI log: per delivery, failed checks by severity, with examples. */
export const text: Writer = (reports, ctx: WriterContext) => {
  const unclaimed = (ctx.unclaimed ?? []).map((f) => oneLine(`${ctx.unclaimedFails ? "ERROR  " : "NOTE   "} ${f}: no contract in tablegate.yaml claims this file; it was not checked`));
  const parts = [...reports.map((r) => delivery(r, ctx.colour)), ...(unclaimed.length ? [unclaimed.join("\n")] : [])];
  // A run can have nothing to check (--changed-since with no changed delivery): say so, not a blank line.
  return parts.length === 0 ? "no delivery to check\n" : parts.join("\n\n") + "\n";
};
