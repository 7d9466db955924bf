/**
 * A 64-bit hash of a sequence of strings, as two independent 32-bit halves (FNV-1a and a
 * multiply-xorshift), fed cell by cell so no joined string is built. A unit separator after each
 * cell keeps ["ab", "c"] apart from ["a", "bc"].
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
      // Locals, not the closure's variables, inside the loop: this runs for every character of a row.
      let a = h1;
      let b = h2;
      for (let i = 0; i < text.length; i++) {
        const c = text.charCodeAt(i);
        a = Math.imul(a ^ c, 0x01000193);
        b = Math.imul(b ^ c, 0x5bd1e995);
        b ^= b >>> 15;
      }
      h1 = Math.imul(a ^ 0x1f, 0x01000193);
      b = Math.imul(b ^ 0x1f, 0x5bd1e995);
      h2 = b ^ (b >>> 15);
    },
    get hi() {
      return h1 >>> 0;
    },
    get lo() {
      return (h2 ^ (h2 >>> 13)) >>> 0;
    },
  };
}
