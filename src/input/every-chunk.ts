import type { Readable } from "node:stream";

/** Chunks held back before the source is paused: bounds memory when the reader is slower than the source. */
const AHEAD = 8;

/**
 * The chunks of a readable stream, every one it produced, then its error if it failed. An async
 * iterator over the stream itself drops chunks still buffered when the stream errors (zlib reports a
 * bad gzip trailer after it has inflated the data before it); this keeps them, so a broken file still
 * delivers everything that could be read.
 */
export async function* everyChunk(stream: Readable): AsyncGenerator<Buffer> {
  const queue: Buffer[] = [];
  let ended = false;
  let failure: unknown;
  let wake: (() => void) | undefined;
  const poke = () => {
    const w = wake;
    wake = undefined;
    w?.();
  };
  stream.on("data", (chunk: Buffer) => {
    queue.push(chunk);
    if (queue.length >= AHEAD) stream.pause();
    poke();
  });
  stream.once("end", () => {
    ended = true;
    poke();
  });
  stream.once("error", (e: unknown) => {
    failure = e;
    ended = true;
    poke();
  });
  for (;;) {
    const next = queue.shift();
    if (next !== undefined) {
      if (queue.length < AHEAD / 2 && failure === undefined) stream.resume();
      yield next;
      continue;
    }
    if (ended) break;
    await new Promise<void>((resolve) => (wake = resolve));
  }
  if (failure !== undefined) throw failure;
}
