/** The reference registry: versioned code-list tables, their lock, diffs and git history. */
export type { RefTable } from "./ref-table.js";
export type { RefColumnType, ManifestTable, Position } from "./manifest.js";
export { parseManifest } from "./manifest.js";
export { parseCsvTable, sha256Hex, type TableContext } from "./csv-table.js";
export { loadRegistry, REPO_MANIFEST, type Registry, type RegistryRoot } from "./load.js";
export { BUILT_IN_NAMES, builtInTables } from "./builtins.js";
export { iso3166Data } from "./iso-3166-1.js";
export {
  LOCK_FILE,
  compareLock,
  computeLock,
  lockIssueProblem,
  parseLock,
  readLock,
  renderLock,
  verifyLock,
  writeLock,
  type Lock,
  type LockEntry,
  type LockIssue,
} from "./lock.js";
export { diffTables, isEmptyDiff, type CellChange, type TableDiff } from "./diff.js";
export { readAtRevision, revisionWithContent, tableAtRevision, tableListedAtRevision } from "./git.js";
