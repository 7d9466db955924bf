/**
 * The golden suite: each folder holds contract.yaml, data.<ext> and expected.json, the last written by
 * hand from SPEC §1–§4 (an oracle independent of the engine). A case is run as a new user would:
 * `check data.<ext> --contract contract.yaml --report json=- [args]`. Compared: exit status, verdict,
 * input.rows, counts, truncated, every check that failed (rule, level, failed) and every finding
 * (the fields each expected finding names; message wording, hashes, sizes and paths are never compared).
 * A folder with `"pending": "<why>"` in expected.json records a known disagreement with SPEC and is
 * expected to fail until the engine is fixed.
 */
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import type { Finding } from "../../src/report/model.js";
import { checkJson } from "../helpers/cli.js";
import { matchesShape, project, type FindingShape } from "../helpers/findings.js";

interface Expected {
  readonly description: string;
  readonly args?: readonly string[];
  readonly exit: number;
  readonly verdict: "pass" | "fail";
  readonly rows: number;
  readonly counts: { readonly error: number; readonly warning: number; readonly note: number; readonly rows_failed?: number };
  readonly truncated: boolean;
  readonly checks: readonly { readonly rule: string; readonly level: string; readonly failed: number }[];
  readonly findings: readonly FindingShape[];
  readonly pending?: string;
}

const here = dirname(fileURLToPath(import.meta.url));
const cases = readdirSync(here, { withFileTypes: true })
  .filter((d) => d.isDirectory() && existsSync(join(here, d.name, "expected.json")))
  .map((d) => d.name)
  .sort();

/** Pair expected with actual findings; the most specific expected findings claim their match first. */
function unmatched(actual: readonly Finding[], expected: readonly FindingShape[]): { missing: FindingShape[]; extra: FindingShape[] } {
  const left = [...actual];
  const missing: FindingShape[] = [];
  const bySpecificity = [...expected].sort((a, b) => Object.keys(b).length - Object.keys(a).length);
  for (const want of bySpecificity) {
    const i = left.findIndex((f) => matchesShape(f, want));
    if (i < 0) missing.push(want);
    else left.splice(i, 1);
  }
  return { missing, extra: left.map(project) };
}

describe("golden cases", () => {
  it("finds the case folders", () => {
    expect(cases.length).toBeGreaterThanOrEqual(15);
  });

  for (const name of cases) {
    const dir = join(here, name);
    const want = JSON.parse(readFileSync(join(dir, "expected.json"), "utf8")) as Expected;
    const test = want.pending ? it.fails : it;
    test(`${name}: ${want.description}`, async () => {
      const dataName = readdirSync(dir).find((f) => f.startsWith("data.")) ?? "data.csv";
      const r = await checkJson(readFileSync(join(dir, "contract.yaml"), "utf8"), readFileSync(join(dir, dataName)), want.args ?? [], dataName);
      const rep = r.report;
      const failedChecks = rep.checks
        .filter((c) => c.failed > 0)
        .map((c) => ({ rule: c.rule, level: c.level, failed: c.failed }))
        .sort((a, b) => a.rule.localeCompare(b.rule));
      const { missing, extra } = unmatched(rep.findings, want.findings);
      const counts = want.counts.rows_failed === undefined ? { ...rep.counts, rows_failed: undefined } : rep.counts;
      // One comparison of everything, so a failing case shows every difference at once.
      expect({
        exit: r.code,
        verdict: rep.verdict,
        rows: rep.input.rows,
        counts,
        truncated: rep.truncated,
        checks: failedChecks,
        missingFindings: missing,
        extraFindings: extra,
      }).toEqual({
        exit: want.exit,
        verdict: want.verdict,
        rows: want.rows,
        counts: { ...want.counts, rows_failed: want.counts.rows_failed },
        truncated: want.truncated,
        checks: [...want.checks].sort((a, b) => a.rule.localeCompare(b.rule)),
        missingFindings: [],
        extraFindings: [],
      });
      expect(r.stderr).not.toMatch(/\n\s+at /);
    });
  }
});
