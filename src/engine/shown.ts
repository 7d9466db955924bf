import { mask } from "../report/mask.js";

/** A cell as the report's `value` holds it: exactly as given, or masked when the column is sensitive. */
export function cellValue(raw: string, sensitive: boolean): string {
  return sensitive ? mask(raw) : raw;
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
