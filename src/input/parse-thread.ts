import { existsSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { Worker } from "node:worker_threads";
import { ok, type Result } from "../problem.js";
import { deliveryOf, openDelivery } from "./open.js";
import { buffersOf, unpackRecords } from "./packed.js";
import type { MainMessage, ParseJob, ParseMessage } from "./parse-thread-messages.js";
import type { ColumnLayout, PrepareSpec } from "../engine/prepare.js";
import type { Delivery, DeliverySummary, InputOptions, RawRecord, StructureBreak } from "./types.js";

const WORKER = new URL("./parse-worker.js", import.meta.url);

/**
 * The parse thread's young generation in MB: 8 MB semi-spaces against Node's 16. What the thread
 * allocates dies within a batch of 64 KB of text, so collecting twice as often costs nothing measurable,
 * and the peak memory of the bench's 1,000,000 rows fell from 242-247 MB to 222-224 MB (measured).
 */
const WORKER_YOUNG_MB = 24;

/**
 * True when the parse thread can start: its compiled script sits beside this module (it does in the
 * built package, not when these sources run untranslated under a test runner).
 */
export function parseThreadAvailable(): boolean {
  return WORKER.protocol === "file:" && existsSync(fileURLToPath(WORKER));
}

type Heard = ParseMessage | { readonly kind: "stopped"; readonly message: string };

/**
 * Opens a delivery whose reading, decoding and parsing run on a second thread while the caller checks
 * the records: the same records, lines, structure break and summary as `openDelivery`, in the same order.
 */
export async function openDeliveryInThread(path: string, options: InputOptions, prepare?: { readonly spec: PrepareSpec; readonly columns?: ColumnLayout }): Promise<Result<Delivery>> {
  const job: ParseJob = { path, options, ...(prepare === undefined ? {} : { prepare: prepare.spec, ...(prepare.columns === undefined ? {} : { columns: prepare.columns }) }) };
  let worker: Worker;
  try {
    worker = new Worker(WORKER, { workerData: job, resourceLimits: { maxYoungGenerationSizeMb: WORKER_YOUNG_MB } });
  } catch {
    return openDelivery(path, options); // no thread to be had: see below
  }
  const heard: Heard[] = [];
  let waiting: ((m: Heard) => void) | undefined;
  let ended = false;
  const hear = (m: Heard): void => {
    if (waiting === undefined) heard.push(m);
    else {
      const w = waiting;
      waiting = undefined;
      w(m);
    }
  };
  worker.on("message", (m: ParseMessage) => {
    if (m.kind === "end" || m.kind === "failed") ended = true;
    hear(m);
  });
  worker.on("error", (e: Error) => hear({ kind: "stopped", message: e.message }));
  worker.on("exit", (code) => {
    if (!ended) hear({ kind: "stopped", message: `it exited with code ${code}` });
  });
  const next = (): Promise<Heard> => {
    const m = heard.shift();
    return m === undefined ? new Promise((resolve) => (waiting = resolve)) : Promise.resolve(m);
  };

  const first = await next();
  if (first.kind !== "opened") {
    await worker.terminate();
    if (first.kind === "failed") return { ok: false, problems: first.problems };
    // A thread that cannot start (a sandbox without workers, no memory for a second heap) costs
    // speed, not the check: read on this thread instead.
    return openDelivery(path, options);
  }

  let broken: StructureBreak | undefined;
  let summary: DeliverySummary | undefined;
  let bytes = 0;
  async function* records(): AsyncGenerator<readonly RawRecord[]> {
    try {
      for (;;) {
        const m = await next();
        if (m.kind === "batch") {
          bytes = m.bytesRead;
          yield unpackRecords(m);
          // The rows are checked: their arrays go back to be filled again.
          const buffers = buffersOf(m);
          worker.postMessage({ kind: "taken", buffers } satisfies MainMessage, buffers);
        } else if (m.kind === "end") {
          broken = m.structureBreak;
          summary = m.summary;
          return;
        } else throw new Error(`the parse thread stopped while reading ${path}: ${m.kind === "stopped" ? m.message : m.kind}`);
      }
    } finally {
      await worker.terminate();
    }
  }

  const columnsFound = (columns: ColumnLayout): void => worker.postMessage({ kind: "columns", columns: { positions: columns.positions, width: columns.width } } satisfies MainMessage);
  return ok(deliveryOf(records(), () => broken, () => bytes, () => summary, columnsFound));
}
