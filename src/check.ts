import { stat } from "node:fs/promises";
import type { Plan } from "./contract/plan.js";
import { runPlan } from "./engine/run.js";
import { openDelivery } from "./input/index.js";
import type { Result } from "./problem.js";
import { buildReport } from "./report/build.js";
import type { DeliveryReport, Level } from "./report/model.js";

export interface CheckOptions {
  /** Path of the delivery as reports should show it. */
  readonly reportPath: string;
  /** Path of the contract as reports should show it. */
  readonly contractPath: string;
  readonly maxFindings?: number;
  readonly failOn?: Level;
  /** Summarise every column (for the HTML report). */
  readonly profile?: boolean;
  /** Told after each batch: rows so far, raw bytes read so far. */
  readonly onProgress?: (rows: number, bytesRead: number) => void;
}

/**
 * Check one delivery file against a compiled contract. A file that cannot be opened is a problem;
 * a file that cannot be read to its end is a `file.structure` finding after everything before it.
 */
export async function checkFile(plan: Plan, file: string, options: CheckOptions): Promise<Result<DeliveryReport>> {
  if (plan.input.format === "xlsx") {
    return { ok: false, problems: [{ file: options.contractPath, message: "input format xlsx is not supported yet; export the sheet as CSV" }] };
  }
  const opened = await openDelivery(file, {
    format: plan.input.format,
    delimiter: plan.input.delimiter,
    ...(plan.input.format === "tsv" ? {} : { quote: plan.input.quote }),
    encoding: plan.input.encoding,
  });
  if (!opened.ok) return opened;
  const delivery = opened.value;
  const size = file.endsWith(".gz") ? undefined : (await stat(file).catch(() => undefined))?.size;
  const { rows, collector, profile } = await runPlan(plan, delivery.records, () => delivery.structureBreak(), {
    maxFindings: options.maxFindings ?? 1000,
    profile: options.profile === true,
    ...(size === undefined ? {} : { sizeHint: size }),
    ...(options.onProgress ? { onBatch: (rows: number) => options.onProgress?.(rows, delivery.bytesRead()) } : {}),
  });
  const summary = delivery.summary();
  const report = buildReport({
    plan,
    collector,
    rows,
    contractPath: options.contractPath,
    failOn: options.failOn ?? "error",
    input: {
      path: options.reportPath, sha256: summary.sha256, bytes: summary.bytes, rows, format: plan.input.format, encoding: summary.encoding,
      ...(summary.note === undefined ? {} : { note: summary.note }),
    },
  });
  return { ok: true, value: profile ? { ...report, profile } : report };
}
