/**
 * Remembers 64-bit hashes and the row where each was first seen, in typed arrays with open addressing
 * (12 bytes a slot, kept at most half full): about 24 MB per million distinct rows, against several
 * times that for a Map of strings. Two different values collide with odds near n²/2⁶⁵ (about 3 in
 * 100 million at a million rows); a collision would report a false repeat, never hide a real one.
 */
export interface SeenSet {
  /** Record the hash for `row` (rows count from 1); returns the first row with the same hash, or 0. */
  firstOrAdd(hi: number, lo: number, row: number): number;
  readonly size: number;
}

export function createSeenSet(initialCapacity = 1 << 12): SeenSet {
  let capacity = initialCapacity;
  let his = new Uint32Array(capacity);
  let los = new Uint32Array(capacity);
  let rows = new Uint32Array(capacity);
  let size = 0;

  const slot = (hi: number, lo: number, mask: number, h: Uint32Array, l: Uint32Array, r: Uint32Array): number => {
    let i = (lo ^ Math.imul(hi, 0x9e3779b1)) & mask;
    while (r[i] !== 0 && (h[i] !== hi || l[i] !== lo)) i = (i + 1) & mask;
    return i;
  };

  const grow = () => {
    const [oh, ol, or] = [his, los, rows];
    capacity *= 2;
    his = new Uint32Array(capacity);
    los = new Uint32Array(capacity);
    rows = new Uint32Array(capacity);
    const mask = capacity - 1;
    for (let j = 0; j < or.length; j++) {
      const row = or[j] ?? 0;
      if (row === 0) continue;
      const i = slot(oh[j] ?? 0, ol[j] ?? 0, mask, his, los, rows);
      his[i] = oh[j] ?? 0;
      los[i] = ol[j] ?? 0;
      rows[i] = row;
    }
  };

  return {
    firstOrAdd(hi, lo, row) {
      const i = slot(hi, lo, capacity - 1, his, los, rows);
      const first = rows[i] ?? 0;
      if (first !== 0) return first;
      his[i] = hi;
      los[i] = lo;
      rows[i] = row;
      if (++size * 2 > capacity) grow();
      return 0;
    },
    get size() {
      return size;
    },
  };
}
