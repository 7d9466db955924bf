/**
 * Where a CSV record ends: RFC 4180 section 2 (rules 5 to 7) lets a line break, a delimiter or a
 * doubled quote stand inside quotes, so a record ends at the first line break outside them. Scans
 * text from `from`, inside quotes or not as `inQuotes` says. Returns the index of that line break,
 * or, when the text ends first, OUTSIDE_QUOTES or INSIDE_QUOTES (negative) for where it ended.
 * Malformed quoting (text after a closing quote, a quote inside an unquoted field) may put the end
 * elsewhere; csv-parse, which reads every record that holds a quote, refuses it at its start either way.
 */
export function recordEnd(text: string, from: number, inQuotes: boolean, quote: string | null): number {
  let p = from;
  let inside = inQuotes;
  for (;;) {
    if (inside) {
      const close = text.indexOf(quote as string, p);
      if (close < 0) return INSIDE_QUOTES;
      p = close + 1;
      inside = false;
    }
    const open = quote === null ? -1 : text.indexOf(quote, p);
    const to = open < 0 ? text.length : open;
    for (let i = p; i < to; i++) {
      const c = text.charCodeAt(i);
      if (c === 0x0a || c === 0x0d) return i;
    }
    if (open < 0) return OUTSIDE_QUOTES;
    p = open + 1;
    inside = true;
  }
}

export const OUTSIDE_QUOTES = -1;
export const INSIDE_QUOTES = -2;
