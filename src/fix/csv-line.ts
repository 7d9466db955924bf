/** How output records are written: the delivery's own delimiter and quote (null: cells are never quoted, as in TSV). */
export interface CsvDialect {
  readonly delimiter: string;
  readonly quote: string | null;
}

/**
 * One record as a CSV line ending in CR LF (RFC 4180 section 2 rules 1, 6, 7): a cell is quoted only
 * when it holds the delimiter, the quote or a line break, with quotes inside doubled. A record of one
 * empty cell is quoted too, since an empty line is no record to our reader.
 */
export function csvLine(cells: readonly string[], dialect: CsvDialect): string {
  const { delimiter, quote } = dialect;
  if (quote === null) return `${cells.join(delimiter)}\r\n`;
  if (cells.length === 1 && cells[0] === "") return `${quote}${quote}\r\n`;
  let line = "";
  for (let i = 0; i < cells.length; i++) {
    const cell = cells[i] as string;
    if (i > 0) line += delimiter;
    line += needsQuotes(cell, delimiter, quote) ? quote + cell.split(quote).join(quote + quote) + quote : cell;
  }
  return `${line}\r\n`;
}

function needsQuotes(cell: string, delimiter: string, quote: string): boolean {
  return cell.includes(delimiter) || cell.includes(quote) || cell.includes("\n") || cell.includes("\r");
}
