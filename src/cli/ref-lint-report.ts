import { createHash } from "node:crypto";
import { readFile } from "node:fs/promises";
import { join } from "node:path";
import type { Problem } from "../problem.js";
import { TOOL_VERSION } from "../report/build.js";
import type { CheckTally, DeliveryReport, Finding } from "../report/model.js";

const RULES = [
  { rule: "registry.manifest", description: "the registry manifest is valid", claims: (f: string) => f.endsWith(".yaml") },
  { rule: "registry.lock", description: "every table matches its lock entry", claims: (f: string) => f.endsWith(".lock.json") },
  { rule: "registry.table", description: "each table has a unique, non-blank key, its declared columns, typed cells and no stray spaces", claims: () => true },
] as const;

async function sha256Of(path: string): Promise<string> {
  try {
    return createHash("sha256").update(await readFile(path)).digest("hex");
  } catch {
    return createHash("sha256").update("").digest("hex");
  }
}

/**
 * `ref lint` findings as delivery reports, one per file with problems (or one clean report for the
 * manifest), so every `--report` format of `check` serves the registry too. Rule ids:
 * `registry.manifest`, `registry.table`, `registry.lock`.
 */
export async function registryLintReports(root: string, manifest: string, problems: readonly Problem[]): Promise<DeliveryReport[]> {
  const files = [...new Set(problems.map((p) => p.file))].sort();
  if (files.length === 0) files.push(manifest);
  const manifestSha = await sha256Of(join(root, manifest));
  return Promise.all(
    files.map(async (file): Promise<DeliveryReport> => {
      const mine = problems.filter((p) => p.file === file);
      const kind = RULES.find((r) => r.claims(file)) ?? RULES[2];
      const findings: Finding[] = mine.map((p) => ({
        rule: kind.rule,
        level: "error",
        ...(p.line === undefined ? {} : { line: p.line }),
        message: p.message,
      }));
      const checks: CheckTally[] = [{ rule: kind.rule, level: "error", failed: findings.length, description: kind.description }];
      return {
        report: 1,
        tool: { name: "tablegate", version: TOOL_VERSION },
        contract: { name: "reference-registry", path: manifest, sha256: manifestSha },
        input: { path: file, sha256: await sha256Of(join(root, file)), bytes: 0, rows: 0, format: "csv", encoding: "utf-8" },
        references: [],
        verdict: findings.length > 0 ? "fail" : "pass",
        counts: { error: findings.length, warning: 0, note: 0, rows_failed: 0 },
        checks,
        findings,
        truncated: false,
      };
    }),
  );
}
