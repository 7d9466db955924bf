const LF = 0x0a;

/**
 * Physical line breaks in text[from, to): LF, CR LF and a lone CR each count once. A CR counts unless
 * an LF follows it, so a range that ends between the two leaves the break to the range after it.
 */
export function breaksIn(text: string, from: number, to: number): number {
  let n = 0;
  for (let i = text.indexOf("\n", from); i >= 0 && i < to; i = text.indexOf("\n", i + 1)) n++;
  for (let i = text.indexOf("\r", from); i >= 0 && i < to; i = text.indexOf("\r", i + 1)) if (text.charCodeAt(i + 1) !== LF) n++;
  return n;
}
