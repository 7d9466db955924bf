import { parentPort, workerData } from "node:worker_threads";
import { openDelivery } from "./open.js";
import { packRecords } from "./packed.js";
import { BATCHES_AHEAD, type ParseJob, type ParseMessage } from "./parse-thread-messages.js";

// The parse thread: reads, decodes and parses one delivery exactly as the main thread would (the same
// openDelivery), and posts its records in packed batches, never more than BATCHES_AHEAD unacknowledged.

// Pieces stay well under V8's large-object size, so each piece's text dies young on the receiving side
// instead of waiting in large-object space for a full collection.
const PIECE_CHARS = 32 * 1024;

const port = parentPort;
if (port !== null) {
  const job = workerData as ParseJob;
  const say = (m: ParseMessage, transfer: ArrayBuffer[] = []): void => port.postMessage(m, transfer);
  let ahead = 0;
  let wake: (() => void) | undefined;
  port.on("message", () => {
    ahead--;
    wake?.();
    wake = undefined;
  });

  const opened = await openDelivery(job.path, job.options);
  if (!opened.ok) say({ kind: "failed", problems: opened.problems });
  else {
    const delivery = opened.value;
    say({ kind: "opened" });
    for await (const batch of delivery.records) {
      for (let from = 0; from < batch.length; ) {
        const { packed, next } = packRecords(batch, from, PIECE_CHARS);
        from = next;
        say({ kind: "batch", text: packed.text, layout: packed.layout, bytesRead: delivery.bytesRead() }, [packed.layout.buffer as ArrayBuffer]);
        ahead++;
        while (ahead >= BATCHES_AHEAD) await new Promise<void>((resolve) => (wake = resolve));
      }
    }
    say({ kind: "end", structureBreak: delivery.structureBreak(), summary: delivery.summary() });
  }
  // The main thread ends this thread once it has heard the last message.
}
