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
  const mix = (c: number) => {
    h1 = Math.imul(h1 ^ c, 0x01000193);
    h2 = Math.imul(h2 ^ c, 0x5bd1e995);
    h2 ^= h2 >>> 15;
  };
  return {
    reset() {
      h1 = 0x811c9dc5;
      h2 = 0x9747b28c;
    },
    add(text: string) {
      for (let i = 0; i < text.length; i++) mix(text.charCodeAt(i));
      mix(0x1f);
    },
    get hi() {
      return h1 >>> 0;
    },
    get lo() {
      return (h2 ^ (h2 >>> 13)) >>> 0;
    },
  };
}
