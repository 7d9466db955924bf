/** An append-only list of unsigned 32-bit numbers in a doubling typed array. */
export interface U32List {
  push(n: number): void;
  at(i: number): number;
  readonly length: number;
}

export function createU32List(initialCapacity = 1024): U32List {
  let data = new Uint32Array(initialCapacity);
  let length = 0;
  return {
    push(n) {
      if (length === data.length) {
        const next = new Uint32Array(data.length * 2);
        next.set(data);
        data = next;
      }
      data[length++] = n;
    },
    at: (i) => data[i] ?? 0,
    get length() {
      return length;
    },
  };
}

/** A set of row numbers as a growable bitmap: 1 bit per row. */
export interface RowBits {
  set(row: number): void;
  has(row: number): boolean;
  readonly count: number;
}

export function createRowBits(): RowBits {
  let bits = new Uint8Array(1 << 12);
  let count = 0;
  return {
    set(row) {
      const byte = row >>> 3;
      if (byte >= bits.length) {
        const next = new Uint8Array(Math.max(bits.length * 2, byte + 1));
        next.set(bits);
        bits = next;
      }
      const mask = 1 << (row & 7);
      if (((bits[byte] ?? 0) & mask) === 0) {
        bits[byte] = (bits[byte] ?? 0) | mask;
        count++;
      }
    },
    has: (row) => (((bits[row >>> 3] ?? 0) >> (row & 7)) & 1) === 1,
    get count() {
      return count;
    },
  };
}
