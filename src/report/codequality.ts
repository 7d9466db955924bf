import type { Level } from "./model.js";
import type { Writer } from "./writer.js";
import { fingerprints } from "./fingerprint.js";
import { findingLine } from "./tally.js";
import { whereText } from "./wording.js";

/** GitLab severities for our levels: an error breaks the contract, a warning asks for a look, a note informs. */
export const CODEQUALITY_SEVERITY: Readonly<Record<Level, "critical" | "major" | "info">> = { error: "critical", warning: "major", note: "info" };

/**
 * GitLab code quality report: a JSON array with one issue per finding, located on the delivery's
 * line (line 1 for whole-file findings), fingerprinted without line numbers (see fingerprint.ts).
 */
export const codequality: Writer = (reports) => {
  const issues = reports.flatMap((report) => {
    const fps = fingerprints(report);
    return report.findings.map((f, i) => {
      const value = f.value === undefined ? "" : `, value ${JSON.stringify(f.value)}`;
      const expected = f.expected === undefined ? "" : `, expected ${f.expected}`;
      return {
        description: `${report.contract.name}: ${f.message} (${whereText(f)}${value}${expected})`,
        check_name: f.rule,
        fingerprint: fps[i] ?? "",
        severity: CODEQUALITY_SEVERITY[f.level],
        location: { path: report.input.path, lines: { begin: findingLine(f) } },
      };
    });
  });
  return `${JSON.stringify(issues, null, 2)}\n`;
};
