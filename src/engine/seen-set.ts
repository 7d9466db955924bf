/**
 * Remembers 64-bit hashes and the row where each was first seen, in one typed array with open
 * addressing (three 32-bit words a slot: hash high, hash low, row; kept at most 70% full): about
 * 17 MB per million distinct rows, against several times that for a Map of strings. Two different
 * values collide with odds near n²/2⁶⁵ (about 3 in 100 million at a million rows); a collision would
 * report a false repeat, never hide a real one.
 */
export interface SeenSet {
  /** Record the hash for `row` (rows count from 1); returns the first row with the same hash, or 0. */
  firstOrAdd(hi: number, lo: number, row: number): number;
  readonly size: number;
}

/**
 * How full the table may get. Linear probing stays short to 70% (about 6 slots looked at for a new
 * hash and 2 for a repeat, by Knuth's estimates for linear probing: from memory), and any slot count
 * is allowed, so the table is sized to what it holds rather than to the next power of two.
 */
const MAX_LOAD = 0.7;

/** A set sized to hold `capacity` hashes before it first grows (it doubles each time after that). */
export function createSeenSet(capacity = 1 << 15): SeenSet {
  let slots = Math.max(4, Math.ceil(capacity / MAX_LOAD));
  let limit = Math.floor(slots * MAX_LOAD);
  let table = new Uint32Array(slots * 3);
  let size = 0;

  /** Word offset of the slot holding (hi, lo), or of the empty slot where it belongs. */
  const find = (t: Uint32Array, n: number, hi: number, lo: number): number => {
    // The mixed hash as a fraction of 2^32, times the slot count: a slot from the hash's high bits.
    let i = Math.floor(((lo ^ Math.imul(hi, 0x9e3779b1)) >>> 0) * (n / 4294967296));
    for (;;) {
      const at = i * 3;
      if (t[at + 2] === 0 || (t[at] === hi && t[at + 1] === lo)) return at;
      i = i + 1 === n ? 0 : i + 1;
    }
  };

  const grow = () => {
    const old = table;
    slots *= 2;
    limit = Math.floor(slots * MAX_LOAD);
    table = new Uint32Array(slots * 3);
    for (let at = 0; at < old.length; at += 3) {
      const row = old[at + 2] as number;
      if (row === 0) continue;
      const hi = old[at] as number;
      const lo = old[at + 1] as number;
      const to = find(table, slots, hi, lo);
      table[to] = hi;
      table[to + 1] = lo;
      table[to + 2] = row;
    }
  };

  return {
    firstOrAdd(hi, lo, row) {
      const at = find(table, slots, hi, lo);
      const first = table[at + 2] as number;
      if (first !== 0) return first;
      table[at] = hi;
      table[at + 1] = lo;
      table[at + 2] = row;
      if (++size > limit) grow();
      return 0;
    },
    get size() {
      return size;
    },
  };
}
