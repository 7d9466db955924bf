const LF = 0x0a;
const CR = 0x0d;

/**
 * Physical line breaks in buf[from, to): LF, CRLF and a lone CR each count once. `crBefore` says the
 * byte just before `from` was a CR, so an LF at `from` completes that break instead of starting one.
 */
export function countBreaks(buf: Buffer, from: number, to: number, crBefore: boolean): number {
  let n = 0;
  let prevCr = crBefore;
  for (let i = from; i < to; i++) {
    const b = buf[i];
    if (b === LF) {
      if (!prevCr) n++;
      prevCr = false;
    } else if (b === CR) {
      n++;
      prevCr = true;
    } else {
      prevCr = false;
    }
  }
  return n;
}

/** Occurrences of CR LF inside the cells of a record (each was counted twice by the CSV parser's line counter). */
export function crlfInCells(cells: readonly string[]): number {
  let n = 0;
  for (const cell of cells) {
    let i = cell.indexOf("\r\n");
    while (i >= 0) {
      n++;
      i = cell.indexOf("\r\n", i + 2);
    }
  }
  return n;
}
