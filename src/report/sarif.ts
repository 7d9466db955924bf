import type { CheckTally, DeliveryReport, Finding } from "./model.js";
import type { Writer, WriterContext } from "./writer.js";
import { fingerprints } from "./fingerprint.js";
import { findingLine, levelRank, tallies } from "./tally.js";
import { whereText } from "./wording.js";

/** GitHub code scanning keeps at most this many results per run (GitHub code-scanning SARIF limits). */
export const SARIF_RESULT_CAP = 25_000;

// The OASIS schema's own id (oasis-tcs/sarif-spec, Schemata/sarif-schema-2.1.0.json).
const SCHEMA_URI = "https://docs.oasis-open.org/sarif/sarif/v2.1.0/errata01/os/schemas/sarif-schema-2.1.0.json";
const BASE = "%SRCROOT%";
const FINGERPRINT_KEY = "tablegateFinding/v1";

type Json = null | boolean | number | string | readonly Json[] | { readonly [k: string]: Json | undefined };

/** One check id across the run; several contracts may declare a check with the same id. */
interface Rule {
  readonly id: string;
  readonly uses: { readonly report: DeliveryReport; readonly tally: CheckTally }[];
}

const artifact = (uri: string): { uri: string; uriBaseId: string } => ({ uri, uriBaseId: BASE });

function contractWhere(report: DeliveryReport, tally: CheckTally): string {
  const c = report.contract;
  const name = c.version === undefined ? c.name : `${c.name} ${c.version}`;
  return tally.source === undefined ? `contract ${name} (${c.path})` : `contract ${name}, ${c.path} line ${tally.source.line}`;
}

/** "discount.max" -> "DiscountMax": the Pascal-case friendly name SARIF recommends (SARIF 2.1.0 §3.49.7). */
const friendlyName = (id: string): string =>
  id
    .split(/[^A-Za-z0-9]+/)
    .filter((w) => w !== "")
    .map((w) => w.charAt(0).toUpperCase() + w.slice(1))
    .join("");

function descriptor(r: Rule): Json {
  const first = r.uses[0];
  const level = first === undefined ? "error" : first.tally.level;
  const described = [...new Set(r.uses.map((u) => u.tally.description))];
  const short = described.join("; ");
  const lines = r.uses.map((u) => {
    const allowance = u.tally.allow === undefined ? "" : ` Up to ${u.tally.allow * 100}% of rows may fail before it counts.`;
    return { text: `${u.tally.description}: declared in ${contractWhere(u.report, u.tally)}.${allowance}`, md: `- **${mdEscape(u.tally.description)}**: declared in ${mdEscape(contractWhere(u.report, u.tally))}.${mdEscape(allowance)}` };
  });
  return {
    id: r.id,
    name: friendlyName(r.id),
    shortDescription: { text: endSentence(short) },
    fullDescription: { text: endSentence(`Check ${r.id}: ${short}`) },
    help: {
      text: `A finding of this check names where the delivery breaks it (row, line, column) and the value found there.\n${lines.map((l) => l.text).join("\n")}`,
      markdown: `A finding of this check names where the delivery breaks it (row, line, column) and the value found there.\n\n${lines.map((l) => l.md).join("\n")}`,
    },
    defaultConfiguration: { level },
    properties: {
      declarations: r.uses.map((u) => ({ contract: u.report.contract.name, path: u.report.contract.path, ...(u.tally.source === undefined ? {} : { line: u.tally.source.line }) })),
    },
  };
}

function result(f: Finding, report: DeliveryReport, tally: CheckTally, index: number, fp: string): Json {
  const src = tally.source;
  const parts = [f.message.trim(), `(${whereText(f)}${f.value === undefined ? "" : `, value ${JSON.stringify(f.value)}`}${f.expected === undefined ? "" : `, expected ${f.expected}`})`];
  return {
    ruleId: f.rule,
    ruleIndex: index,
    level: f.level,
    message: { text: endSentence(parts.join(" ")) },
    locations: [{ physicalLocation: { artifactLocation: artifact(report.input.path), region: { startLine: findingLine(f) } } }],
    ...(src === undefined
      ? {}
      : {
          relatedLocations: [
            {
              id: 1,
              message: { text: `Check ${tally.rule} is declared here.` },
              physicalLocation: { artifactLocation: artifact(report.contract.path), region: { startLine: src.line, startColumn: src.column } },
            },
          ],
        }),
    partialFingerprints: { [FINGERPRINT_KEY]: fp },
    properties: {
      contract: report.contract.name,
      ...(f.row === undefined ? {} : { row: f.row }),
      ...(f.column === undefined ? {} : { column: f.column }),
      ...(f.value === undefined ? {} : { value: f.value }),
      ...(f.expected === undefined ? {} : { expected: f.expected }),
    },
  };
}

/**
 * SARIF 2.1.0: one run for all deliveries, one rule per contract check (help text names the contract
 * line), one result per finding placed on the delivery's line (line 1 for whole-file findings) with
 * the declaring contract line as related location. A CSV column is not a character column, so regions
 * carry lines only; the column name is in the message and properties. At most SARIF_RESULT_CAP results,
 * most severe first; the cap and what it left out are stated in the run's properties and as a
 * tool execution notification.
 */
export const sarif: Writer = (reports: readonly DeliveryReport[], ctx: WriterContext): string => {
  const rules: Rule[] = [];
  const index = new Map<string, number>();
  interface Pending { readonly f: Finding; readonly report: DeliveryReport; readonly tally: CheckTally; readonly ruleIndex: number; readonly fp: string; readonly order: number }
  const pending: Pending[] = [];
  for (const report of reports) {
    const byRule = new Map<string, CheckTally>();
    for (const tally of tallies(report)) {
      byRule.set(tally.rule, tally);
      const at = index.get(tally.rule);
      if (at === undefined) {
        index.set(tally.rule, rules.length);
        rules.push({ id: tally.rule, uses: [{ report, tally }] });
      } else {
        rules[at]?.uses.push({ report, tally });
      }
    }
    const fps = fingerprints(report);
    report.findings.forEach((f, i) => {
      const tally = byRule.get(f.rule);
      const ri = index.get(f.rule);
      // tallies() covers every finding's rule, so both lookups succeed.
      if (tally !== undefined && ri !== undefined) pending.push({ f, report, tally, ruleIndex: ri, fp: fps[i] ?? "", order: pending.length });
    });
  }
  const kept =
    pending.length <= SARIF_RESULT_CAP
      ? pending
      : [...pending].sort((a, b) => levelRank(a.f.level) - levelRank(b.f.level) || a.order - b.order).slice(0, SARIF_RESULT_CAP).sort((a, b) => a.order - b.order);
  const omitted = pending.length - kept.length;
  const cutByEngine = reports.filter((r) => r.truncated);

  const notifications: Json[] = [];
  if (omitted > 0) {
    notifications.push({
      level: "warning",
      descriptor: { id: "results-capped" },
      message: { text: `Only the ${SARIF_RESULT_CAP} most severe of ${pending.length} findings are listed; ${omitted} were left out. The JSON report has them all.` },
    });
  }
  for (const r of cutByEngine) {
    // Every finding has exactly one level, so the level counts sum to all findings, notes included.
    const total = r.counts.error + r.counts.warning + r.counts.note;
    notifications.push({
      level: "warning",
      descriptor: { id: "findings-truncated" },
      message: { text: `${r.input.path}: the check stopped listing findings after ${r.findings.length} of ${total}; the counts per rule are exact.` },
    });
  }

  const artifacts: Json[] = [];
  const listed = new Set<string>();
  for (const r of reports) {
    for (const [path, sha, roles, length] of [
      [r.input.path, r.input.sha256, ["analysisTarget"], r.input.bytes],
      [r.contract.path, r.contract.sha256, ["policy"], undefined],
    ] as const) {
      if (listed.has(path)) continue;
      listed.add(path);
      artifacts.push({ location: artifact(path), roles, hashes: { "sha-256": sha }, ...(length === undefined ? {} : { length }) });
    }
  }

  const log: Json = {
    $schema: SCHEMA_URI,
    version: "2.1.0",
    runs: [
      {
        tool: { driver: { name: "tablegate", version: ctx.toolVersion, semanticVersion: ctx.toolVersion, rules: rules.map(descriptor) } },
        invocations: [{ executionSuccessful: true, ...(notifications.length === 0 ? {} : { toolExecutionNotifications: notifications }) }],
        columnKind: "utf16CodeUnits",
        artifacts,
        results: kept.map((p) => result(p.f, p.report, p.tally, p.ruleIndex, p.fp)),
        properties: { resultCap: SARIF_RESULT_CAP, resultsOmitted: omitted, findingsListed: pending.length, findingsTotal: reports.reduce((n, r) => n + r.counts.error + r.counts.warning + r.counts.note, 0), fingerprint: "sha256(contract, delivery path, rule, column, value, occurrence)" },
      },
    ],
  };
  return `${JSON.stringify(log, null, 2)}\n`;
};

function endSentence(s: string): string {
  const t = s.trim();
  return /[.!?]$/.test(t) ? t : `${t}.`;
}

function mdEscape(s: string): string {
  return s.replace(/[\\`*_[\]<>|]/g, (c) => `\\${c}`);
}
