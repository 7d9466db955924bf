import { writeFile } from "node:fs/promises";
import { isAbsolute, join } from "node:path";
import type { Result } from "../problem.js";
import type { DeliveryReport } from "../report/model.js";
import { TOOL_VERSION } from "../report/build.js";
import { WRITERS, type ReportFormat } from "../report/formats.js";
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
export async function writeReports(reports: readonly DeliveryReport[], targets: readonly ReportTarget[], io: Io, root: string, unclaimed: readonly string[] = []): Promise<Result<void>> {
  const all = targets.some((t) => t.path === "-") ? targets : [{ format: "text" as const, path: "-" }, ...targets];
  const ctx = { root, toolVersion: TOOL_VERSION, unclaimed };
  for (const t of all) {
    const body = WRITERS[t.format](reports, ctx);
    if (t.path === "-") {
      io.stdout(body);
      continue;
    }
    const path = isAbsolute(t.path) ? t.path : join(io.cwd, t.path);
    try {
      await writeFile(path, body);
    } catch (e) {
      return { ok: false, problems: [{ file: t.path, message: `cannot write ${t.format} report: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}` }] };
    }
  }
  return { ok: true, value: undefined };
}
