import type { CheckTally, DeliveryReport, Finding } from "./model.js";
import type { Writer } from "./writer.js";
import { counts, findingsByTally, tallies, tallyKey } from "./tally.js";
import { formatCount, whereText } from "./wording.js";
import { xmlAttr, xmlText } from "./xml-escape.js";

/** How many findings a failure body lists before "and N more". */
export const JUNIT_FINDINGS_PER_CASE = 20;

function findingLine(f: Finding): string {
  const value = f.value === undefined ? "" : `: value ${JSON.stringify(f.value)}`;
  const expected = f.expected === undefined ? "" : `, expected ${f.expected}`;
  return `- ${whereText(f)}${value}${expected} (${f.message})`;
}

function body(report: DeliveryReport, tally: CheckTally, found: readonly Finding[]): string {
  const shown = found.slice(0, JUNIT_FINDINGS_PER_CASE);
  const lines = [`${tally.description}`];
  if (tally.source !== undefined) lines.push(`declared in ${report.contract.path} line ${tally.source.line}`);
  if (tally.allow !== undefined) lines.push(`allowed share ${tally.allow}, actual share ${tally.share ?? "unknown"}`);
  lines.push(`${formatCount(tally.failed)} in ${report.input.path}:`, ...shown.map(findingLine));
  const more = tally.failed - shown.length;
  if (more > 0) lines.push(`and ${formatCount(more)} more; see the full report`);
  return `${lines.join("\n")}\n`;
}

/** Which checks fail their testcase: error checks that count, or, when only warnings failed the verdict, those warnings. */
function failing(report: DeliveryReport, checks: readonly CheckTally[]): (c: CheckTally) => boolean {
  const errorsCount = checks.some((c) => c.level === "error" && counts(c));
  if (errorsCount || report.verdict === "pass") return (c) => c.level === "error" && counts(c);
  return (c) => c.level === "warning" && counts(c);
}

function suite(report: DeliveryReport, id: number): { xml: string; tests: number; failures: number } {
  const checks = tallies(report, { byLevel: true });
  const byTally = findingsByTally(report);
  const fails = failing(report, checks);
  const c = report.contract;
  const props: [string, string][] = [
    ["contract", c.name],
    ...(c.version === undefined ? [] : ([["contract.version", c.version]] as [string, string][])),
    ["contract.path", c.path],
    ["contract.sha256", c.sha256],
    ["delivery.path", report.input.path],
    ["delivery.sha256", report.input.sha256],
    ["delivery.rows", String(report.input.rows)],
    ["verdict", report.verdict],
    ...report.references.map((r): [string, string] => [`reference.${r.table}`, `${r.version} sha256:${r.sha256}`]),
  ];
  const cases: string[] = [];
  let failures = 0;
  const named = new Set<string>();
  for (const t of checks) {
    // A check's findings at another level (notes under an error check) are a testcase of their own.
    const name = named.has(t.rule) ? `${t.rule} (${t.level})` : t.rule;
    named.add(t.rule);
    const open = `    <testcase classname="${xmlAttr(c.name)}" name="${xmlAttr(name)}"`;
    if (t.failed === 0) {
      cases.push(`${open}/>`);
      continue;
    }
    const text = xmlText(body(report, t, byTally.get(tallyKey(t.rule, t.level)) ?? []));
    if (fails(t)) {
      failures += 1;
      const message = `${formatCount(t.failed)} ${t.failed === 1 ? "finding" : "findings"}: ${t.description}`;
      cases.push(`${open}>\n      <failure message="${xmlAttr(message)}" type="${t.level}">${text}</failure>\n    </testcase>`);
    } else {
      cases.push(`${open}>\n      <system-out>${text}</system-out>\n    </testcase>`);
    }
  }
  const name = `${c.name} ${report.input.path}`;
  const xml = [
    `  <testsuite name="${xmlAttr(name)}" tests="${checks.length}" failures="${failures}" errors="0" skipped="0" id="${id}" package="${xmlAttr(c.name)}">`,
    "    <properties>",
    ...props.map(([k, v]) => `      <property name="${xmlAttr(k)}" value="${xmlAttr(v)}"/>`),
    "    </properties>",
    ...cases,
    // Empty, but the Ant schema demands both at the end of a suite.
    "    <system-out/>",
    "    <system-err/>",
    "  </testsuite>",
  ].join("\n");
  return { xml, tests: checks.length, failures };
}

/**
 * JUnit XML in the Jenkins/Ant shape: one testsuite per delivery, one testcase per check
 * (classname = contract, name = check id). An error check that counts against the verdict has a
 * failure whose body lists its first findings; warnings and notes with findings pass, their findings
 * in system-out (unless only warnings failed the verdict, as with --fail-on warning). No times or
 * timestamps: the output is deterministic.
 */
export const junit: Writer = (reports) => {
  const suites = reports.map((r, i) => suite(r, i));
  const tests = suites.reduce((n, s) => n + s.tests, 0);
  const failures = suites.reduce((n, s) => n + s.failures, 0);
  const out = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<testsuites name="tablegate" tests="${tests}" failures="${failures}" errors="0">`,
    ...suites.map((s) => s.xml),
    "</testsuites>",
  ];
  return `${out.join("\n")}\n`;
};
