import { isUtf8 } from "node:buffer";

/** Validates UTF-8 across chunk boundaries without decoding; holds back at most 3 bytes of a split sequence. */
export interface Utf8Checker {
  /** Offset in `chunk` of the first byte of an ill-formed sequence, or -1 when all is well so far. */
  check(chunk: Buffer): number;
  /** True when the input did not end inside a sequence. */
  complete(): boolean;
}

/** A fresh checker; the common case (a chunk that is valid as a whole) costs one native `isUtf8` call. */
export function createUtf8Checker(): Utf8Checker {
  let carry: Buffer | undefined;
  return {
    check(chunk) {
      let start = 0;
      if (carry !== undefined) {
        const need = sequenceLength(carry[0] ?? 0) - carry.length;
        const take = Math.min(need, chunk.length);
        const joined = Buffer.concat([carry, chunk.subarray(0, take)]);
        if (take < need) {
          for (let i = carry.length; i < joined.length; i++) if (!isContinuation(joined[i] ?? 0)) return 0;
          carry = joined;
          return -1;
        }
        carry = undefined;
        // The broken sequence began in an earlier chunk; nothing of this one is usable.
        if (!isUtf8(joined)) return 0;
        start = take;
      }
      const tail = incompleteTail(chunk, start);
      const end = chunk.length - tail;
      if (!isUtf8(chunk.subarray(start, end))) return start + Math.max(0, firstInvalid(chunk, start, end));
      if (tail > 0) carry = Buffer.from(chunk.subarray(end));
      return -1;
    },
    complete() {
      return carry === undefined;
    },
  };
}

/** Bytes a sequence starting with `lead` should span; 0 for a byte that cannot start one. */
function sequenceLength(lead: number): number {
  if (lead < 0x80) return 1;
  if (lead >= 0xc2 && lead <= 0xdf) return 2;
  if (lead >= 0xe0 && lead <= 0xef) return 3;
  if (lead >= 0xf0 && lead <= 0xf4) return 4;
  return 0;
}

const isContinuation = (b: number): boolean => (b & 0xc0) === 0x80;

/** Length of a sequence cut off by the end of the chunk: a lead byte followed only by continuation bytes. */
function incompleteTail(buf: Buffer, start: number): number {
  const len = buf.length;
  for (let p = len - 1; p >= Math.max(start, len - 3); p--) {
    const b = buf[p] ?? 0;
    if (isContinuation(b)) continue;
    const want = sequenceLength(b);
    return want > len - p ? len - p : 0;
  }
  return 0;
}

/**
 * Offset of the first ill-formed sequence in buf[from, to), following the well-formed byte sequences
 * of the Unicode Standard, Table 3-7 (no overlongs, no surrogates, nothing above U+10FFFF).
 */
export function firstInvalid(buf: Buffer, from: number, to: number): number {
  let i = from;
  while (i < to) {
    const b = buf[i] ?? 0;
    if (b < 0x80) {
      i++;
      continue;
    }
    const n = sequenceLength(b);
    if (n === 0 || i + n > to) return i - from;
    const b1 = buf[i + 1] ?? 0;
    let lo = 0x80;
    let hi = 0xbf;
    if (b === 0xe0) lo = 0xa0;
    else if (b === 0xed) hi = 0x9f;
    else if (b === 0xf0) lo = 0x90;
    else if (b === 0xf4) hi = 0x8f;
    if (b1 < lo || b1 > hi) return i - from;
    for (let k = 2; k < n; k++) if (!isContinuation(buf[i + k] ?? 0)) return i - from;
    i += n;
  }
  return -1;
}
