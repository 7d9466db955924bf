/**
 * Cell texts (after trimming) that exports commonly write for "no value", in the order a draft lists
 * them. Common practice, no source: spreadsheet (#N/A), R (NA), SQL dumps (NULL), pandas (NaN, None).
 */
export const BLANK_MARKERS: readonly string[] = ["NA", "N/A", "n/a", "#N/A", "NULL", "null", "None", "NaN", "nan", "-"];

const INDEX = new Map(BLANK_MARKERS.map((m, i) => [m, i] as const));
const LONGEST = Math.max(...BLANK_MARKERS.map((m) => m.length));

/** Index of a trimmed text in BLANK_MARKERS, or -1. */
export function markerIndex(text: string): number {
  return text.length > LONGEST ? -1 : (INDEX.get(text) ?? -1);
}
