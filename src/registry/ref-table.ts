import type { RefColumnType } from "./manifest.js";

/** One loaded code-list table: metadata plus hash-map lookups built once. */
export interface RefTable {
  readonly name: string;
  readonly version: string;
  readonly source?: string;
  readonly description?: string;
  /** CSV path relative to the repository root, or `(built-in)/<name>` for tables shipped with tablegate */
  readonly file: string;
  /** true for iso-3166-1, us-states and ca-provinces: versioned with tablegate, never locked */
  readonly builtIn: boolean;
  /** the registry.yaml the table came from (repository-relative), or `(built-in)` */
  readonly origin: string;
  /** where the table's name is written in `origin` (absent for iso-3166-1, which has no manifest) */
  readonly declaredAt?: { readonly line: number; readonly column: number };
  /** the key column (single-column keys only) */
  readonly key: string;
  readonly keyIndex: number;
  /** every column in file order, the key included */
  readonly columns: readonly string[];
  readonly types: readonly RefColumnType[];
  readonly rows: number;
  /** SHA-256 (hex) of the CSV bytes; for iso-3166-1, of its canonical CSV rendering */
  readonly sha256: string;
  /** the set of non-blank values in a column (built once, on first use); undefined for an unknown column */
  values(column: string): ReadonlySet<string> | undefined;
  /** value of column `columnIndex` in the row keyed by `key`; null when there is no such row or the cell is blank */
  get(key: string, columnIndex: number): string | null;
  /** the whole row keyed by `key` */
  row(key: string): readonly string[] | undefined;
  /** keys in file order */
  keys(): readonly string[];
}

/** What a table is apart from its rows. */
export type RefTableMeta = Omit<RefTable, "keyIndex" | "rows" | "values" | "get" | "row" | "keys">;

/** Build a table from rows already checked (key present, unique and non-blank, widths right). */
export function makeRefTable(meta: RefTableMeta, records: readonly (readonly string[])[]): RefTable {
  const keyIndex = meta.columns.indexOf(meta.key);
  const byKey = new Map<string, readonly string[]>();
  const keys: string[] = [];
  for (const r of records) {
    const k = r[keyIndex] ?? "";
    byKey.set(k, r);
    keys.push(k);
  }
  const valueSets = new Map<string, ReadonlySet<string>>();
  return {
    ...meta,
    keyIndex,
    rows: records.length,
    values(column) {
      const cached = valueSets.get(column);
      if (cached) return cached;
      const i = meta.columns.indexOf(column);
      if (i < 0) return undefined;
      const set = new Set<string>();
      for (const r of records) {
        const v = r[i];
        if (v !== undefined && v !== "") set.add(v);
      }
      valueSets.set(column, set);
      return set;
    },
    get(key, columnIndex) {
      const v = byKey.get(key)?.[columnIndex];
      return v === undefined || v === "" ? null : v;
    },
    row: (key) => byKey.get(key),
    keys: () => keys,
  };
}
