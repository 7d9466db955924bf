/** The seen-set behind key and whole-row duplicate checks: 64-bit hashes to the first row that had them. */
import { describe, expect, it } from "vitest";
import { createSeenSet } from "../../src/engine/seen-set.js";

/** A small deterministic generator of 32-bit words (xorshift32), so failures reproduce. */
function words(seed: number): () => number {
  let x = seed >>> 0 || 1;
  return () => {
    x ^= x << 13;
    x >>>= 0;
    x ^= x >>> 17;
    x ^= x << 5;
    x >>>= 0;
    return x;
  };
}

describe("seen-set", () => {
  it("returns 0 for a new hash and the first row for every repeat", () => {
    const s = createSeenSet();
    expect(s.firstOrAdd(1, 2, 1)).toBe(0);
    expect(s.firstOrAdd(3, 4, 2)).toBe(0);
    expect(s.firstOrAdd(1, 2, 3)).toBe(1);
    expect(s.firstOrAdd(1, 2, 4)).toBe(1);
    expect(s.firstOrAdd(3, 4, 5)).toBe(2);
    expect(s.size).toBe(2);
  });

  it("both halves of the hash count: same hi or same lo is a different hash", () => {
    const s = createSeenSet(4);
    expect(s.firstOrAdd(7, 7, 1)).toBe(0);
    expect(s.firstOrAdd(7, 8, 2)).toBe(0);
    expect(s.firstOrAdd(8, 7, 3)).toBe(0);
    expect(s.firstOrAdd(0, 0, 4)).toBe(0);
    expect(s.firstOrAdd(0xffffffff, 0xffffffff, 5)).toBe(0);
    expect([s.firstOrAdd(7, 8, 9), s.firstOrAdd(8, 7, 9), s.firstOrAdd(0, 0, 9), s.firstOrAdd(0xffffffff, 0xffffffff, 9)]).toEqual([2, 3, 4, 5]);
    expect(s.size).toBe(5);
  });

  it("growing from a tiny table keeps every entry and its first row", () => {
    const s = createSeenSet(1);
    const n = 5000;
    // Same lo for many entries forces long probe runs that must survive every doubling.
    for (let i = 1; i <= n; i++) expect(s.firstOrAdd(i, i % 3, i)).toBe(0);
    expect(s.size).toBe(n);
    let wrong = 0;
    for (let i = 1; i <= n; i++) if (s.firstOrAdd(i, i % 3, n + i) !== i) wrong++;
    expect(wrong).toBe(0);
    expect(s.size).toBe(n);
  });

  it("200,000 random distinct hashes are all new, then all found at their first row", () => {
    const next = words(20240615);
    const n = 200_000;
    const hi = new Uint32Array(n);
    const lo = new Uint32Array(n);
    const distinct = new Set<bigint>();
    for (let i = 0; i < n; ) {
      const h = next();
      const l = next();
      const key = (BigInt(h) << 32n) | BigInt(l);
      if (distinct.has(key)) continue;
      distinct.add(key);
      hi[i] = h;
      lo[i] = l;
      i++;
    }
    const s = createSeenSet(16);
    let repeats = 0;
    for (let i = 0; i < n; i++) if (s.firstOrAdd(hi[i] ?? 0, lo[i] ?? 0, i + 1) !== 0) repeats++;
    expect(repeats).toBe(0);
    expect(s.size).toBe(n);
    let misplaced = 0;
    for (let i = 0; i < n; i++) if (s.firstOrAdd(hi[i] ?? 0, lo[i] ?? 0, n + 1) !== i + 1) misplaced++;
    expect(misplaced).toBe(0);
  });
});
