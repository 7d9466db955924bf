/**
 * Remembers 64-bit hashes and the row where each was first seen, in one typed array with open
 * addressing (three 32-bit words a slot: hash high, hash low, row; kept at most half full): about
 * 24 MB per million distinct rows, against several times that for a Map of strings. Two different
 * values collide with odds near n²/2⁶⁵ (about 3 in 100 million at a million rows); a collision would
 * report a false repeat, never hide a real one.
 */
export interface SeenSet {
  /** Record the hash for `row` (rows count from 1); returns the first row with the same hash, or 0. */
  firstOrAdd(hi: number, lo: number, row: number): number;
  readonly size: number;
}

export function createSeenSet(initialSlots = 1 << 16): SeenSet {
  // Probing masks with slots - 1, so the slot count must be a power of two.
  let slots = 4;
  while (slots < initialSlots) slots *= 2;
  let table = new Uint32Array(slots * 3);
  let size = 0;

  /** Word offset of the slot holding (hi, lo), or of the empty slot where it belongs. */
  const find = (t: Uint32Array, mask: number, hi: number, lo: number): number => {
    let i = (lo ^ Math.imul(hi, 0x9e3779b1)) & mask;
    for (;;) {
      const at = i * 3;
      if (t[at + 2] === 0 || (t[at] === hi && t[at + 1] === lo)) return at;
      i = (i + 1) & mask;
    }
  };

  const grow = () => {
    const old = table;
    slots *= 2;
    table = new Uint32Array(slots * 3);
    const mask = slots - 1;
    for (let at = 0; at < old.length; at += 3) {
      const row = old[at + 2] as number;
      if (row === 0) continue;
      const hi = old[at] as number;
      const lo = old[at + 1] as number;
      const to = find(table, mask, hi, lo);
      table[to] = hi;
      table[to + 1] = lo;
      table[to + 2] = row;
    }
  };

  return {
    firstOrAdd(hi, lo, row) {
      const at = find(table, slots - 1, hi, lo);
      const first = table[at + 2] as number;
      if (first !== 0) return first;
      table[at] = hi;
      table[at + 1] = lo;
      table[at + 2] = row;
      if (++size * 2 > slots) grow();
      return 0;
    },
    get size() {
      return size;
    },
  };
}
