/**
 * Text on one line: line breaks, tabs and other control characters from a delivery or table shown
 * escaped. A line that would start with `::` (after spaces) has its first colon escaped too: on a
 * CI runner such a line on stdout is a workflow command, and a file or column name could forge one.
 */
export const oneLine = (s: string): string =>
  s
    .replace(/[\u0000-\u001f\u007f]/g, (c) => (c === "\n" ? "\\n" : c === "\r" ? "\\r" : c === "\t" ? "\\t" : `\\u${c.charCodeAt(0).toString(16).padStart(4, "0")}`))
    .replace(/^(\s*):(?=:)/, "$1\\u003a");
