/** Text safe in HTML content and in quoted attribute values (HTML Living Standard, escaping a string). */
export function escapeHtml(s: string): string {
  return s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&#39;");
}

/**
 * A delivery value for display: controls shown as their escapes (\r, \n, \u0007), so nothing
 * invisible hides in it, then HTML-escaped.
 */
export function htmlValue(s: string): string {
  return escapeHtml(s.replace(/[\u0000-\u001F\u007F]/g, (c) => JSON.stringify(c).slice(1, -1)));
}
