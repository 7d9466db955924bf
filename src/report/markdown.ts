/**
 * Text safe in a GitHub-flavoured Markdown table cell: control characters shown as escapes, Markdown
 * and HTML metacharacters neutralised, pipes escaped, so a delivery value can neither end the cell,
 * start a link or emphasis, nor inject HTML.
 */
export function mdCell(s: string): string {
  // JSON string escapes make CR, LF and other controls visible; quotes need none in a cell.
  const visible = JSON.stringify(s).slice(1, -1).replace(/\\"/g, '"');
  return visible
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/[\\`*_[\]|#~!]/g, (c) => `\\${c}`);
}

/** A code span for ids and paths; text with backticks or controls falls back to an escaped plain cell. */
export function mdCode(s: string): string {
  // Backslash escapes do not work inside code spans, except `\|` in GFM table cells.
  if (/[`\u0000-\u001F]/.test(s)) return mdCell(s);
  return `\`${s.replace(/\|/g, "\\|")}\``;
}
