/**
 * ArrayBuffers that cross between the threads and come back to be used again. Each packed piece of
 * rows carries four typed arrays (its layout and its prepared rows, about 150 bytes a row); made anew
 * for every piece, a million rows would pass some 150 MB of memory outside the heap through each
 * thread, freed only as collections get round to it.
 */
export interface BufferPool {
  /** A typed array of `length` zeroed elements, over a spare buffer when one is large enough. */
  take<T extends Uint8Array | Uint32Array | Int32Array | Float64Array>(make: TypedArrayMaker<T>, length: number): T;
  /** Buffers the other thread has finished with. */
  giveBack(buffers: readonly ArrayBuffer[]): void;
}

export interface TypedArrayMaker<T> {
  new (buffer: ArrayBuffer, byteOffset: number, length: number): T;
  readonly BYTES_PER_ELEMENT: number;
}

/** Spare buffers are kept up to this many; the pieces in flight need four each. */
const MAX_SPARE = 64;

export function createBufferPool(): BufferPool {
  const spare: ArrayBuffer[] = [];
  return {
    take(make, length) {
      const bytes = length * make.BYTES_PER_ELEMENT;
      let buffer: ArrayBuffer | undefined;
      for (let i = 0; i < spare.length; i++) {
        if ((spare[i] as ArrayBuffer).byteLength >= bytes) {
          buffer = spare[i] as ArrayBuffer;
          spare[i] = spare[spare.length - 1] as ArrayBuffer;
          spare.pop();
          break;
        }
      }
      // New buffers are rounded up to a whole 4 KB, so a slightly longer piece can reuse them.
      const view = new make(buffer ?? new ArrayBuffer(Math.ceil(Math.max(bytes, 1) / 4096) * 4096), 0, length);
      if (buffer !== undefined) view.fill(0);
      return view;
    },
    giveBack(buffers) {
      for (const b of buffers) if (spare.length < MAX_SPARE && b.byteLength > 0) spare.push(b);
    },
  };
}

/** A fresh typed array each time: for readers with no other thread to hand arrays back. */
export const NO_POOL: BufferPool = {
  take: (make, length) => new make(new ArrayBuffer(length * make.BYTES_PER_ELEMENT), 0, length),
  giveBack: () => undefined,
};
