import { mask } from "../report/mask.js";

/** A cell as the report's `value` holds it: exactly as given, or masked when the column is sensitive. */
export function cellValue(raw: string, sensitive: boolean): string {
  return sensitive ? mask(raw) : raw;
}

/** A value inside a sentence: quoted when blank or padded with spaces, so the reader sees them. */
export function quoted(text: string): string {
  return text === "" || text.trim() !== text ? JSON.stringify(text) : text;
}

/** A cell inside a sentence: masked when sensitive, quoted when blank or padded. */
export function shownValue(raw: string, sensitive: boolean): string {
  return quoted(cellValue(raw, sensitive));
}
