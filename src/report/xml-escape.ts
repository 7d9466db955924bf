// Characters XML 1.0 forbids even as references (XML 1.0 §2.2 Char): C0 controls other than tab,
// LF and CR, lone surrogates, U+FFFE and U+FFFF. They become a visible [U+XXXX] so the reader sees them.
const NOT_XML_CHAR = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;

const codePoint = (c: string): string => `[U+${(c.codePointAt(0) ?? 0).toString(16).toUpperCase().padStart(4, "0")}]`;

/** Text safe inside an XML element: markup escaped, characters XML cannot carry made visible, CR kept. */
export function xmlText(s: string): string {
  return s
    .replace(NOT_XML_CHAR, codePoint)
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/\r/g, "&#13;");
}

/**
 * Text safe inside a double-quoted XML attribute; tab, LF and CR become references because attribute
 * value normalisation would otherwise turn them into spaces (XML 1.0 §3.3.3).
 */
export function xmlAttr(s: string): string {
  return xmlText(s).replace(/"/g, "&quot;").replace(/\t/g, "&#9;").replace(/\n/g, "&#10;");
}
