// The pool behind the arrays that cross between the parse thread and the main thread.
import { describe, expect, it } from "vitest";
import { createBufferPool } from "../../src/input/buffer-pool.js";

describe("buffer pool", () => {
  it("gives zeroed arrays of the length asked, over a buffer handed back when it is large enough", () => {
    const pool = createBufferPool();
    const a = pool.take(Float64Array, 100);
    expect(a.length).toBe(100);
    a.fill(7);
    const buffer = a.buffer as ArrayBuffer;
    pool.giveBack([buffer]);
    // Too large for the spare buffer (4 KB, rounded up from 800 bytes): a new one.
    const big = pool.take(Uint8Array, 5000);
    expect(big.buffer).not.toBe(buffer);
    const again = pool.take(Uint32Array, 50);
    expect(again.buffer).toBe(buffer);
    expect([...again].every((x) => x === 0)).toBe(true);
    // Taken once, it is no longer spare.
    expect(pool.take(Uint32Array, 50).buffer).not.toBe(buffer);
  });

  it("ignores buffers already given away (detached, length 0)", () => {
    const pool = createBufferPool();
    const a = pool.take(Uint8Array, 10);
    const moved = structuredClone(a.buffer, { transfer: [a.buffer as ArrayBuffer] });
    expect(moved.byteLength).toBe(4096);
    pool.giveBack([a.buffer as ArrayBuffer]);
    expect(pool.take(Uint8Array, 1).buffer).not.toBe(a.buffer);
  });
});
