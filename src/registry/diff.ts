import { keyText } from "../engine/key-text.js";
import type { RefColumnType } from "./manifest.js";
import type { RefTable } from "./ref-table.js";
import { typedCell } from "./typed-cell.js";

/** One cell that differs between two versions of a row. */
export interface CellChange {
  readonly column: string;
  readonly before: string;
  readonly after: string;
}

/** What changed between two versions of a table, rows matched by key. */
export interface TableDiff {
  readonly table: string;
  readonly versionBefore: string;
  readonly versionAfter: string;
  readonly columnsAdded: readonly string[];
  readonly columnsRemoved: readonly string[];
  /** keys only in `after`, in its file order */
  readonly added: readonly string[];
  /** keys only in `before`, in its file order */
  readonly removed: readonly string[];
  /** keys in both whose cells differ in a column both versions have, in `after`'s order */
  readonly changed: readonly { readonly key: string; readonly changes: readonly CellChange[] }[];
}

/** True when nothing but the version differs. */
export function isEmptyDiff(d: TableDiff): boolean {
  return d.columnsAdded.length + d.columnsRemoved.length + d.added.length + d.removed.length + d.changed.length === 0;
}

/** Compare two versions of a table by key (each version's own key column). */
export function diffTables(before: RefTable, after: RefTable): TableDiff {
  const shared = after.columns
    .map((c, ai) => ({ column: c, ai, bi: before.columns.indexOf(c), type: after.types[ai] }))
    .filter((c) => c.bi >= 0);
  const added: string[] = [];
  const changed: { key: string; changes: CellChange[] }[] = [];
  for (const key of after.keys()) {
    const b = before.row(key);
    const a = after.row(key);
    if (!b) {
      added.push(key);
      continue;
    }
    if (!a) continue;
    const changes: CellChange[] = [];
    for (const { column, ai, bi, type } of shared) {
      const va = a[ai] ?? "";
      const vb = b[bi] ?? "";
      if (va !== vb && !sameValue(type, va, vb)) changes.push({ column, before: vb, after: va });
    }
    if (changes.length > 0) changed.push({ key, changes });
  }
  return {
    table: after.name,
    versionBefore: before.version,
    versionAfter: after.version,
    columnsAdded: after.columns.filter((c) => !before.columns.includes(c)),
    columnsRemoved: before.columns.filter((c) => !after.columns.includes(c)),
    added,
    removed: before.keys().filter((k) => after.row(k) === undefined),
    changed,
  };
}

/** In a typed column, cells that spell one value (55000 and 55000.00) are no change for any check. */
function sameValue(type: RefColumnType | undefined, a: string, b: string): boolean {
  if (type === undefined || type === "text" || a === "" || b === "") return false;
  return keyText(typedCell(type, a), a) === keyText(typedCell(type, b), b);
}
