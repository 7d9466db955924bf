/** The input format a file name implies: .csv, .tsv, .ndjson or .jsonl, each optionally .gz. */
export function formatFromName(path: string): "csv" | "tsv" | "ndjson" | undefined {
  const name = path.toLowerCase().replace(/\.gz$/, "");
  if (name.endsWith(".csv")) return "csv";
  if (name.endsWith(".tsv")) return "tsv";
  if (name.endsWith(".ndjson") || name.endsWith(".jsonl")) return "ndjson";
  return undefined;
}

/** A contract name from a file name: lower-case letters, digits and dashes (`Dealer Sales W47.csv` -> `dealer-sales-w47`). */
export function nameFromFile(path: string): string {
  const base = path.split(/[\\/]/).pop() ?? "";
  const stem = base.replace(/\.gz$/i, "").replace(/\.(csv|tsv|ndjson|jsonl)$/i, "");
  const slug = stem.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-+|-+$/g, "");
  return slug === "" ? "delivery" : slug;
}
