import { parentPort, workerData } from "node:worker_threads";
import { createPreparer, type ColumnLayout, type Preparer } from "../engine/prepare.js";
import { openDelivery } from "./open.js";
import { createBufferPool } from "./buffer-pool.js";
import { buffersOf, packRecords } from "./packed.js";
import { BATCHES_AHEAD, type MainMessage, type ParseJob, type ParseMessage } from "./parse-thread-messages.js";

// The parse thread: reads, decodes and parses one delivery exactly as the main thread would (the same
// openDelivery), prepares its rows when asked (see engine/prepare.ts), and posts them in packed
// batches, never more than BATCHES_AHEAD unacknowledged.

// Pieces stay well under V8's large-object size, so each piece's text dies young on the receiving side
// instead of waiting in large-object space for a full collection.
const PIECE_CHARS = 32 * 1024;

const port = parentPort;
if (port !== null) {
  const job = workerData as ParseJob;
  const say = (m: ParseMessage, transfer: ArrayBuffer[] = []): void => port.postMessage(m, transfer);
  let ahead = 0;
  let columns: ColumnLayout | undefined = job.columns;
  let wake: (() => void) | undefined;
  const pool = createBufferPool();
  port.on("message", (m: MainMessage) => {
    if (m.kind === "columns") columns = m.columns;
    else {
      ahead--;
      pool.giveBack(m.buffers);
    }
    wake?.();
    wake = undefined;
  });
  const heard = (): Promise<void> => new Promise<void>((resolve) => (wake = resolve));

  const opened = await openDelivery(job.path, job.options);
  if (!opened.ok) say({ kind: "failed", problems: opened.problems });
  else {
    const delivery = opened.value;
    say({ kind: "opened" });
    let preparer: Preparer | undefined;
    // With a header to match, the main thread must say where the columns are before rows can be prepared.
    let awaitingHeader = job.prepare !== undefined && columns === undefined;
    for await (const batch of delivery.records) {
      let from = 0;
      if (awaitingHeader && batch.length > 0) {
        const { packed } = packRecords(batch, 0, 0);
        say({ kind: "batch", text: packed.text, layout: packed.layout, bytesRead: delivery.bytesRead() }, [packed.layout.buffer as ArrayBuffer]);
        ahead++;
        awaitingHeader = false;
        while (columns === undefined) await heard();
        from = 1;
      }
      while (from < batch.length) {
        const { packed, next } = packRecords(batch, from, PIECE_CHARS, pool);
        const prepared = job.prepare !== undefined && columns !== undefined ? (preparer ??= createPreparer(job.prepare, columns)).prepare(batch, from, next, pool) : undefined;
        from = next;
        const piece = { text: packed.text, layout: packed.layout, ...(prepared ? { prepared } : {}) };
        say({ kind: "batch", ...piece, bytesRead: delivery.bytesRead() }, buffersOf(piece));
        ahead++;
        while (ahead >= BATCHES_AHEAD) await heard();
      }
    }
    say({ kind: "end", structureBreak: delivery.structureBreak(), summary: delivery.summary() });
  }
  // The main thread ends this thread once it has heard the last message.
}
