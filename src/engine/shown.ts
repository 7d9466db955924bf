import { mask } from "../report/mask.js";

/** How much of one cell a report shows; a cell can be megabytes long (up to MAX_RECORD_SIZE). */
export const SHOWN_CAP = 1000;

/**
 * A cell as the report's `value` holds it: exactly as given, or masked when the column is sensitive;
 * past SHOWN_CAP characters cut, ending in `…(+N)` with N the characters left out, as masks do.
 */
export function cellValue(raw: string, sensitive: boolean): string {
  const text = sensitive ? mask(raw) : raw;
  return text.length <= SHOWN_CAP ? text : capped(text);
}

function capped(text: string): string {
  let n = SHOWN_CAP;
  const last = text.charCodeAt(n - 1);
  if (last >= 0xd800 && last <= 0xdbff) n--; // never half a surrogate pair
  // A copy, not a view: a kept finding must not hold the whole cell (or the batch it came from) alive.
  return Buffer.from(`${text.slice(0, n)}…(+${text.length - n})`, "utf16le").toString("utf16le");
}

// C0 controls and DEL: a line break inside a value must never start a new line in a log.
const CONTROL = /[\u0000-\u001f\u007f]/;

/** A value inside a sentence: quoted (JSON escapes) when blank, padded or holding control characters. */
export function quoted(text: string): string {
  return text === "" || text.trim() !== text || CONTROL.test(text) ? JSON.stringify(text) : text;
}

/** A cell inside a sentence: masked when sensitive, quoted when blank or padded. */
export function shownValue(raw: string, sensitive: boolean): string {
  return quoted(cellValue(raw, sensitive));
}
