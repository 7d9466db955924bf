import { stat } from "node:fs/promises";
import { availableParallelism } from "node:os";
import type { Plan } from "./contract/plan.js";
import { positional } from "./engine/header.js";
import { prepareSpecOf, type ColumnLayout } from "./engine/prepare.js";
import { runPlan } from "./engine/run.js";
import { openDelivery, type Delivery, type InputOptions } from "./input/index.js";
import { openDeliveryInThread, parseThreadAvailable } from "./input/parse-thread.js";
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
  /**
   * Read and parse on a second thread while the checks run on this one: `auto` (the default) does for
   * files of PARSE_THREAD_MIN_BYTES or more on a machine with two or more cores.
   */
  readonly parseThread?: "auto" | "on" | "off";
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
  const input: InputOptions = {
    format: plan.input.format,
    delimiter: plan.input.delimiter,
    ...(plan.input.format === "tsv" ? {} : { quote: plan.input.quote }),
    encoding: plan.input.encoding,
  };
  const onDisk = (await stat(file).catch(() => undefined))?.size;
  const size = file.endsWith(".gz") ? undefined : onDisk;
  // The parse thread also prepares the rows; without a header it knows at once where the columns are.
  const prepare = { spec: prepareSpecOf(plan, size), ...(plan.input.header === "none" ? { columns: columnsOf(positional(plan)) } : {}) };
  const opened = useParseThread(options.parseThread ?? "auto", onDisk) ? await openDeliveryInThread(file, input, prepare) : await openDelivery(file, input);
  if (!opened.ok) return opened;
  const delivery: Delivery = opened.value;
  const { rows, collector, profile } = await runPlan(plan, delivery.records, () => delivery.structureBreak(), {
    maxFindings: options.maxFindings ?? 1000,
    profile: options.profile === true,
    ...(size === undefined ? {} : { sizeHint: size }),
    onHeader: (columns) => delivery.columnsFound?.(columns),
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

/** Below this size a second thread's start-up costs more than it saves. */
export const PARSE_THREAD_MIN_BYTES = 8 * 1024 * 1024;

function useParseThread(choice: "auto" | "on" | "off", bytes: number | undefined): boolean {
  if (choice === "off" || !parseThreadAvailable()) return false;
  return choice === "on" || (bytes !== undefined && bytes >= PARSE_THREAD_MIN_BYTES && availableParallelism() >= 2);
}

const columnsOf = (h: ColumnLayout): ColumnLayout => ({ positions: h.positions, width: h.width });
