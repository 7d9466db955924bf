/**
 * A 64-bit hash of a sequence of strings, as two 32-bit lanes (FNV-1a over pairs of UTF-16 units,
 * and a multiply-add lane), fed cell by cell so no joined string is built. Each cell's length is mixed
 * in after it, which keeps ["ab", "c"] apart from ["a", "bc"].
 */
export interface RowHasher {
  reset(): void;
  add(text: string): void;
  readonly hi: number;
  readonly lo: number;
}

export function createRowHasher(): RowHasher {
  let h1 = 0x811c9dc5;
  let h2 = 0x9747b28c;
  return {
    reset() {
      h1 = 0x811c9dc5;
      h2 = 0x9747b28c;
    },
    add(text: string) {
      // Locals, not the closure's variables, and two UTF-16 units a step: this runs for every
      // character of every row. The two lanes multiply by different odd constants, one xor-ing and
      // one adding, and mix once more at the end of each cell.
      let a = h1;
      let b = h2;
      const n = text.length;
      let i = 0;
      for (; i + 1 < n; i += 2) {
        const c = text.charCodeAt(i) | (text.charCodeAt(i + 1) << 16);
        a = Math.imul(a ^ c, 0x01000193);
        b = Math.imul(b + c, 0x2c1b3c6d);
      }
      if (i < n) {
        const c = text.charCodeAt(i);
        a = Math.imul(a ^ c, 0x01000193);
        b = Math.imul(b + c, 0x2c1b3c6d);
      }
      // The cell's length ends it: separates cells, and "x" from "x\u0000" (same units once paired).
      h1 = Math.imul(a ^ (n + 0x1f), 0x01000193);
      b ^= b >>> 15;
      h2 = Math.imul(b + n + 0x1f, 0x2c1b3c6d);
    },
    get hi() {
      return h1 >>> 0;
    },
    get lo() {
      return (h2 ^ (h2 >>> 13)) >>> 0;
    },
  };
}
