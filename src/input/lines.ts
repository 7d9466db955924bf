const LF = 0x0a;
const CR = 0x0d;

/**
 * Physical line breaks in text[from, to): LF, CR LF and a lone CR each count once. A CR counts unless
 * an LF follows it, so a range that ends between the two leaves the break to the range after it.
 * A loop over the range, not indexOf: indexOf would look past `to` for a CR a file may never have.
 */
export function breaksIn(text: string, from: number, to: number): number {
  let n = 0;
  for (let i = from; i < to; i++) {
    const c = text.charCodeAt(i);
    if (c === LF || (c === CR && text.charCodeAt(i + 1) !== LF)) n++;
  }
  return n;
}
