import { mask } from "../report/mask.js";

/** A cell as a report shows it: masked when sensitive, quoted when blank or padded with spaces. */
export function shownValue(raw: string, sensitive: boolean): string {
  const text = sensitive ? mask(raw) : raw;
  return text === "" || text.trim() !== text ? JSON.stringify(text) : text;
}
