import { appendFile, readFile } from "node:fs/promises";
import { writeWholeFile } from "../atomic-file.js";
import { isAbsolute, join } from "node:path";
import type { Result } from "../problem.js";
import type { DeliveryReport } from "../report/model.js";
import { TOOL_VERSION } from "../report/build.js";
import { WRITERS, type ReportFormat } from "../report/formats.js";
import { githubSummary } from "../report/github-summary.js";
import { wantColour } from "../report/colour.js";
import type { Io } from "./io.js";

export interface ReportTarget {
  readonly format: ReportFormat;
  /** "-" for stdout. */
  readonly path: string;
}

/** Parse `--report <format>=<path>` values; a bare format means stdout. */
export function parseReportTargets(values: readonly string[]): { ok: true; value: ReportTarget[] } | { ok: false; message: string } {
  const out: ReportTarget[] = [];
  for (const v of values) {
    const eq = v.indexOf("=");
    const format = eq < 0 ? v : v.slice(0, eq);
    const path = eq < 0 ? "-" : v.slice(eq + 1);
    if (!(format in WRITERS)) return { ok: false, message: `invalid option --report ${v}: unknown format "${format}"; expected one of ${Object.keys(WRITERS).join(", ")}` };
    if (path === "") return { ok: false, message: `invalid option --report ${v}: expected <format>=<path>, or - for stdout` };
    out.push({ format: format as ReportFormat, path });
  }
  return { ok: true, value: out };
}

/** Write every requested report; text goes to stdout unless another report already does. */
export async function writeReports(reports: readonly DeliveryReport[], targets: readonly ReportTarget[], io: Io, root: string, unclaimed: readonly string[] = [], unclaimedFails = false): Promise<Result<void>> {
  // In a GitHub Actions job with no report named, annotate the files as well as printing text.
  const named = targets.length > 0 || io.env.GITHUB_ACTIONS !== "true" ? targets : [{ format: "github" as const, path: "-" }];
  const all = named.some((t) => t.path === "-" && t.format !== "github") ? named : [{ format: "text" as const, path: "-" }, ...named];
  const ctx = { root, toolVersion: TOOL_VERSION, unclaimed, unclaimedFails };
  const terminal = { ...ctx, colour: wantColour(io.env, io.stdoutIsTty === true) };
  const summaryFile = io.env.GITHUB_STEP_SUMMARY;
  if (all.some((t) => t.format === "github") && summaryFile) {
    try {
      // Start on a line of its own, whatever an earlier step left at the end of the file.
      const before = await readFile(summaryFile).catch(() => Buffer.alloc(0));
      const gap = before.length > 0 && before[before.length - 1] !== 0x0a ? "\n" : "";
      await appendFile(summaryFile, gap + githubSummary(reports, ctx));
    } catch (e) {
      return { ok: false, problems: [{ file: summaryFile, message: `cannot append the step summary: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}` }] };
    }
  }
  for (const t of all) {
    const body = WRITERS[t.format](reports, t.path === "-" ? terminal : ctx);
    if (t.path === "-") {
      io.stdout(body);
      continue;
    }
    const path = isAbsolute(t.path) ? t.path : join(io.cwd, t.path);
    const written = await writeWholeFile(path, body);
    if (!written.ok) return { ok: false, problems: written.problems.map((p) => ({ ...p, file: t.path, message: `cannot write ${t.format} report: ${p.message.replace(/^cannot be written: /, "")}` })) };
  }
  return { ok: true, value: undefined };
}
