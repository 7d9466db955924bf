import type { CheckTally, ColumnProfile, DeliveryReport, Finding, Level } from "./model.js";
import type { Writer, WriterContext } from "./writer.js";
import { escapeHtml as esc, htmlValue } from "./html-escape.js";
import { LEVEL_COLOUR, barChart, histogram } from "./svg-charts.js";
import { findingsByTally, levelRank, tallies, tallyKey } from "./tally.js";
import { formatCount, plural } from "./wording.js";

/** Findings shown per check in the HTML report. */
export const HTML_FINDINGS_PER_CHECK = 10;

const LEVEL_WORD: Readonly<Record<Level, string>> = { error: "Error", warning: "Warning", note: "Note" };

const STYLE = `
:root{--ink:#1d1d1f;--muted:#5f6368;--line:#dadce0;--bg:#f7f7f5;--ok:#1e6b34;--bad:#b3261e}
*{box-sizing:border-box}
body{margin:0;font:15px/1.5 system-ui,-apple-system,"Segoe UI",Roboto,"Noto Sans",sans-serif;color:var(--ink);background:var(--bg)}
main{max-width:1080px;margin:0 auto;padding:24px}
h1{font-size:26px;margin:0 0 4px}
h2{font-size:20px;margin:0 0 6px;word-break:break-all}
h3{font-size:16px;margin:24px 0 8px}
.verdict{font-size:18px;font-weight:600;padding:12px 16px;border-radius:8px;color:#fff;margin:12px 0 20px}
.verdict.fail{background:var(--bad)}.verdict.pass{background:var(--ok)}
.delivery{background:#fff;border:1px solid var(--line);border-radius:10px;padding:20px 24px;margin:0 0 24px}
.badge{display:inline-block;font-size:13px;font-weight:700;letter-spacing:.04em;padding:2px 8px;border-radius:4px;color:#fff;vertical-align:middle;margin-right:8px}
.badge.fail{background:var(--bad)}.badge.pass{background:var(--ok)}
.lead{font-size:17px;margin:4px 0 12px}
.muted,.facts{color:var(--muted)}
.facts{font-size:13px;margin:0 0 8px;display:flex;flex-wrap:wrap;gap:2px 20px}
.facts code{overflow-wrap:anywhere}
code{font-family:ui-monospace,"SF Mono",Menlo,Consolas,monospace;font-size:.92em}
table{border-collapse:collapse;width:100%;margin:4px 0 8px;font-size:14px}
th,td{border-bottom:1px solid var(--line);padding:5px 8px;text-align:left;vertical-align:top}
th{font-weight:600;background:#f1f3f4}
td.num,th.num{text-align:right;font-variant-numeric:tabular-nums;white-space:nowrap}
td{overflow-wrap:break-word}
.lvl{font-weight:600}.lvl-error{color:${LEVEL_COLOUR.error}}.lvl-warning{color:${LEVEL_COLOUR.warning}}.lvl-note{color:${LEVEL_COLOUR.note}}
mark{background:#ffe08a;color:#000;padding:0 2px;border-radius:2px;white-space:pre-wrap;overflow-wrap:break-word;outline:1px solid #e0b400}
.bars .bar-label{font-size:13px;fill:var(--ink)}.bars .bar-value{font-size:13px;fill:var(--ink);font-weight:600}
.hist rect{fill:#5b7fb5}.hist .axis{stroke:#9aa0a6;stroke-width:1}
.share{display:inline-block;width:60px;height:8px;background:#e8eaed;border-radius:4px;margin-right:6px;vertical-align:middle;overflow:hidden}
.share i{display:block;height:100%;background:#9aa0a6}
table.found{table-layout:fixed}
table.found col.n{width:76px}table.found col.c{width:15%}table.found col.v{width:27%}table.found col.e{width:17%}
table.profile td{vertical-align:middle}
details{border:1px solid var(--line);border-radius:8px;margin:8px 0;padding:0 12px}
summary{cursor:pointer;padding:8px 0;font-weight:600}
summary .muted{font-weight:400}
.passed{font-size:14px}
footer{color:var(--muted);font-size:13px;margin:8px 0 32px}
`;

function checkMeaning(report: DeliveryReport, t: CheckTally): string {
  const where = t.source === undefined ? "" : ` <span class="muted">(contract line ${t.source.line})</span>`;
  return `${esc(t.description)}${where}`;
}

function facts(r: DeliveryReport): string {
  const c = r.contract;
  const refs =
    r.references.length === 0
      ? "none"
      : r.references.map((x) => `${esc(x.table)} ${esc(x.version)}`).join(", ");
  return (
    `<p class="facts"><span>Contract: <code>${esc(c.name)}</code>${c.version === undefined ? "" : ` version ${esc(c.version)}`} (<code>${esc(c.path)}</code>)</span>` +
    `<span>File: ${formatCount(r.input.bytes)} bytes, ${esc(r.input.format)}, ${esc(r.input.encoding)}</span>` +
    `<span>Code lists used: ${refs}</span></p>`
  );
}

function lead(r: DeliveryReport): string {
  const total = r.counts.error + r.counts.warning + r.counts.note;
  if (total === 0) return `<p class="lead">No problems found in ${plural(r.input.rows, "row")}.</p>`;
  const kinds = [plural(r.counts.error, "error"), plural(r.counts.warning, "warning"), plural(r.counts.note, "note")].join(", ");
  return `<p class="lead"><strong>${plural(total, "problem")}</strong> in ${formatCount(r.counts.rows_failed)} of ${plural(r.input.rows, "row")} (${kinds}).</p>`;
}

function chart(r: DeliveryReport, failing: readonly CheckTally[], passed: readonly CheckTally[]): string {
  if (failing.length === 0) return `<p class="passed">All ${plural(passed.length, "check")} passed.</p>`;
  const svg = barChart(
    failing.map((t) => ({ label: t.rule, value: t.failed, level: t.level, hint: t.description })),
    `Problems per check in ${r.input.path}`,
  );
  const passedList =
    passed.length === 0 ? "" : `<p class="passed muted">Passed: ${passed.map((t) => `<code>${esc(t.rule)}</code>`).join(", ")}.</p>`;
  return (
    `<h3>Problems per check</h3>` +
    `<p class="muted">Errors make the delivery fail; warnings and notes ask for a look. Colours: <span class="lvl lvl-error">error</span>, <span class="lvl lvl-warning">warning</span>, <span class="lvl lvl-note">note</span>.</p>` +
    svg +
    passedList
  );
}

function checkTable(r: DeliveryReport, failing: readonly CheckTally[]): string {
  if (failing.length === 0) return "";
  const rows = failing.map((t) => {
    const allowance =
      t.allow === undefined ? "" : `<br><span class="muted">${t.within_allowance === true ? "within" : "over"} the allowed ${esc(String(t.allow * 100))}% of rows</span>`;
    return (
      `<tr><td><code>${esc(t.rule)}</code></td><td class="lvl lvl-${t.level}">${LEVEL_WORD[t.level]}</td>` +
      `<td class="num">${formatCount(t.failed)}</td><td>${checkMeaning(r, t)}${allowance}</td></tr>`
    );
  });
  return (
    `<h3>What the checks demand</h3><table><thead><tr><th>Check</th><th>Level</th><th class="num">Problems</th><th>What it demands</th></tr></thead>` +
    `<tbody>${rows.join("")}</tbody></table>`
  );
}

function where(f: Finding): string {
  return f.row === undefined ? (f.line === undefined ? "whole file" : "header") : formatCount(f.row);
}

function findingsSection(r: DeliveryReport, failing: readonly CheckTally[]): string {
  if (failing.length === 0) return "";
  const byTally = findingsByTally(r);
  const blocks = failing.map((t) => {
    const found = byTally.get(tallyKey(t.rule, t.level)) ?? [];
    const shown = found.slice(0, HTML_FINDINGS_PER_CHECK);
    const rows = shown.map(
      (f) =>
        `<tr><td class="num">${where(f)}</td><td class="num">${f.line === undefined ? "" : formatCount(f.line)}</td>` +
        `<td>${f.column === undefined ? "" : `<code>${esc(f.column)}</code>`}</td>` +
        `<td>${f.value === undefined ? "" : `<mark>${htmlValue(f.value)}</mark>`}</td>` +
        `<td>${f.expected === undefined ? "" : htmlValue(f.expected)}</td><td>${htmlValue(f.message)}</td></tr>`,
    );
    const more = t.failed - shown.length;
    const tail = more > 0 ? `<p class="muted">and ${plural(more, "more problem")} of this kind; the JSON report lists them.</p>` : "";
    const table =
      shown.length === 0
        ? `<p class="muted">No individual rows listed for this check.</p>`
        : `<table class="found"><colgroup><col class="n"><col class="n"><col class="c"><col class="v"><col class="e"><col></colgroup><thead><tr><th class="num">Row</th><th class="num">Line</th><th>Column</th><th>Value found</th><th>Expected</th><th>What is wrong</th></tr></thead><tbody>${rows.join("")}</tbody></table>`;
    return (
      `<details open><summary><code>${esc(t.rule)}</code> <span class="lvl lvl-${t.level}">${LEVEL_WORD[t.level]}</span> · ` +
      `${plural(t.failed, "problem")} <span class="muted">— ${esc(t.description)}</span></summary>${table}${tail}</details>`
    );
  });
  return (
    `<h3>First problems per check</h3>` +
    `<p class="muted">“Row” counts data records from 1 (the header is not a row); “Line” is the line in the file where the record starts. The value found is highlighted.</p>` +
    blocks.join("")
  );
}

function profileSection(r: DeliveryReport): string {
  if (r.profile === undefined) return `<h3>Columns at a glance</h3><p class="muted">This report has no column profile.</p>`;
  const rows = r.profile.map((p: ColumnProfile) => {
    const total = p.filled + p.blank;
    const share = total === 0 ? 0 : p.blank / total;
    const pct = `${(share * 100).toFixed(share > 0 && share < 0.001 ? 2 : 1)}%`;
    const hist = p.histogram === undefined || p.histogram.length === 0 ? "" : histogram(p.histogram, `Distribution of ${p.column} from ${p.min ?? "?"} to ${p.max ?? "?"}`);
    return (
      `<tr><td><code>${esc(p.column)}</code></td><td>${esc(p.type)}</td>` +
      `<td class="num"><span class="share"><i style="width:${(share * 100).toFixed(1)}%"></i></span>${pct}</td>` +
      `<td class="num">${p.distinct_capped ? "more than " : ""}${formatCount(p.distinct)}</td>` +
      `<td>${p.min === undefined ? "" : `<code>${htmlValue(p.min)}</code>`}</td><td>${p.max === undefined ? "" : `<code>${htmlValue(p.max)}</code>`}</td><td>${hist}</td></tr>`
    );
  });
  return (
    `<h3>Columns at a glance</h3>` +
    `<table class="profile"><thead><tr><th>Column</th><th>Type</th><th class="num">Blank cells</th><th class="num">Distinct values</th><th>Smallest</th><th>Largest</th><th>Distribution</th></tr></thead>` +
    `<tbody>${rows.join("")}</tbody></table>`
  );
}

function delivery(r: DeliveryReport): string {
  const checks = tallies(r, { byLevel: true });
  const failing = [...checks].filter((t) => t.failed > 0).sort((a, b) => levelRank(a.level) - levelRank(b.level) || b.failed - a.failed);
  const passed = checks.filter((t) => t.failed === 0);
  const cut = r.truncated ? `<p class="muted">Only the first ${plural(r.findings.length, "problem")} were recorded one by one; the counts are complete.</p>` : "";
  return (
    `<section class="delivery"><h2><span class="badge ${r.verdict}">${r.verdict === "pass" ? "PASS" : "FAIL"}</span>${esc(r.input.path)}</h2>` +
    lead(r) +
    facts(r) +
    cut +
    chart(r, failing, passed) +
    checkTable(r, failing) +
    findingsSection(r, failing) +
    profileSection(r) +
    `</section>`
  );
}

function footer(reports: readonly DeliveryReport[], ctx: WriterContext): string {
  const refs = new Map<string, string>();
  for (const r of reports) for (const x of r.references) refs.set(`${x.table} ${x.version}`, x.sha256);
  const contracts = new Map<string, string>();
  for (const r of reports) contracts.set(`${r.contract.name}${r.contract.version === undefined ? "" : ` ${r.contract.version}`}`, r.contract.sha256);
  const list = (m: Map<string, string>): string =>
    m.size === 0 ? "none" : [...m].map(([k, sha]) => `${esc(k)} <span title="sha256 ${esc(sha)}">(sha256 ${esc(sha.slice(0, 12))}…)</span>`).join("; ");
  return `<footer><p>Contracts: ${list(contracts)}.<br>Reference code lists: ${list(refs)}.<br>Checked by tablegate ${esc(ctx.toolVersion)}.</p></footer>`;
}

/**
 * One self-contained HTML page for people who never saw a contract: verdict, per delivery the
 * problem counts per check as a bar chart, what each check demands, the first failing rows with the
 * value highlighted, a column profile, and the contract and code list versions. No script, no external
 * resource; a Content-Security-Policy forbids both.
 */
export const html: Writer = (reports, ctx) => {
  const failed = reports.filter((r) => r.verdict === "fail").length;
  const verdict =
    reports.length === 0
      ? "No deliveries were checked."
      : failed === 0
        ? `${reports.length === 1 ? "The delivery meets" : `All ${reports.length} deliveries meet`} their contract.`
        : `${formatCount(failed)} of ${plural(reports.length, "delivery", "deliveries")} ${failed === 1 ? "does" : "do"} not meet ${failed === 1 ? "its" : "their"} contract.`;
  const title = `Delivery check: ${failed === 0 ? "pass" : "fail"}`;
  return (
    `<!DOCTYPE html>\n<html lang="en"><head><meta charset="utf-8">` +
    `<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">` +
    `<meta name="viewport" content="width=device-width, initial-scale=1"><title>${esc(title)}</title><style>${STYLE}</style></head>\n` +
    `<body><main><h1>Delivery check</h1>` +
    `<p class="muted">Each delivered file was checked against its contract: the written agreement on which columns it has and which values are allowed.</p>` +
    `<p class="verdict ${failed === 0 ? "pass" : "fail"}">${esc(verdict)}</p>\n` +
    reports.map(delivery).join("\n") +
    `\n${footer(reports, ctx)}</main></body></html>\n`
  );
};
