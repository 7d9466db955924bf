import { mkdir, readFile } from "node:fs/promises";
import { writeWholeFile } from "../atomic-file.js";
import { dirname, join } from "node:path";
import { fail, ok, type Problem, type Result } from "../problem.js";
import type { Registry } from "./load.js";
import { linkOutReason } from "../project/inside.js";

/** The lock file, relative to the repository root. */
export const LOCK_FILE = "reference/registry.lock.json";

/** What the lock pins for one table. */
export interface LockEntry {
  readonly version: string;
  readonly rows: number;
  readonly sha256: string;
  /** the CSV, relative to the repository root (lets `ref diff` find the locked content in git history) */
  readonly file: string;
}

/** reference/registry.lock.json: every non-built-in table of the registry, by name. */
export interface Lock {
  readonly tables: Readonly<Record<string, LockEntry>>;
}

/** How one table stands against the lock. */
export interface LockIssue {
  readonly table: string;
  /** no-lock: the lock file is missing; unlocked: no entry; changed: content, version or row count differ; stale: entry for a table no longer in the registry */
  readonly kind: "no-lock" | "unlocked" | "changed" | "stale";
  readonly locked?: LockEntry;
  readonly current?: LockEntry;
}

/** The lock the registry calls for now. Built-in tables are left out: they are versioned with tablegate. */
export function computeLock(registry: Registry): Lock {
  const tables: Record<string, LockEntry> = {};
  for (const t of [...registry.tables()].sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0))) {
    if (t.builtIn) continue;
    tables[t.name] = { version: t.version, rows: t.rows, sha256: t.sha256, file: t.file };
  }
  return { tables };
}

/** The lock as written to disk: stable key order, two-space indent, final newline. */
export function renderLock(lock: Lock): string {
  const tables: Record<string, LockEntry> = {};
  for (const name of Object.keys(lock.tables).sort()) {
    const e = lock.tables[name];
    if (e) tables[name] = { version: e.version, rows: e.rows, sha256: e.sha256, file: e.file };
  }
  return JSON.stringify({ lock: 1, tables }, null, 2) + "\n";
}

function isEntry(v: unknown): v is LockEntry {
  if (v === null || typeof v !== "object") return false;
  const e = v as Record<string, unknown>;
  return typeof e.version === "string" && typeof e.rows === "number" && typeof e.sha256 === "string" && /^[0-9a-f]{64}$/.test(e.sha256) && typeof e.file === "string";
}

/** Parse lock text; a malformed lock is a problem, never a silent pass. */
export function parseLock(text: string): Result<Lock> {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch {
    return fail({ file: LOCK_FILE, message: "lock is not valid JSON; run `tablegate ref lock`" });
  }
  const d = data as { lock?: unknown; tables?: unknown } | null;
  if (d === null || typeof d !== "object" || d.lock !== 1 || d.tables === null || typeof d.tables !== "object" || Array.isArray(d.tables)) {
    return fail({ file: LOCK_FILE, message: 'lock must be {"lock": 1, "tables": {...}}; run `tablegate ref lock`' });
  }
  const tables: Record<string, LockEntry> = {};
  for (const [name, e] of Object.entries(d.tables as Record<string, unknown>)) {
    if (!isEntry(e)) return fail({ file: LOCK_FILE, message: `lock entry "${name}" must have version, rows, sha256 (64 hex digits) and file; run \`tablegate ref lock\`` });
    tables[name] = e;
  }
  return ok({ tables });
}

/** Read reference/registry.lock.json; undefined when there is none. */
export async function readLock(repoRoot: string): Promise<Result<Lock | undefined>> {
  const linked = await lockLinkedOut(repoRoot);
  if (linked !== undefined) return fail({ file: LOCK_FILE, message: `lock ${linked}` });
  let text: string;
  try {
    text = await readFile(join(repoRoot, LOCK_FILE), "utf8");
  } catch (e) {
    if ((e as { code?: string }).code === "ENOENT") return ok(undefined);
    return fail({ file: LOCK_FILE, message: "cannot read the lock" });
  }
  return parseLock(text);
}

/**
 * Compare the registry with a lock. With `used`, only those tables are compared (a check run); without,
 * every table is, and lock entries for tables that no longer exist are reported as stale.
 */
export function compareLock(lock: Lock | undefined, registry: Registry, used?: readonly string[]): LockIssue[] {
  const current = computeLock(registry).tables;
  const names = used ? [...new Set(used)].filter((n) => current[n] !== undefined).sort() : Object.keys(current);
  const issues: LockIssue[] = [];
  for (const name of names) {
    const now = current[name];
    if (!now) continue;
    const locked = lock?.tables[name];
    if (!lock) issues.push({ table: name, kind: "no-lock", current: now });
    else if (!locked) issues.push({ table: name, kind: "unlocked", current: now });
    else if (locked.sha256 !== now.sha256 || locked.version !== now.version || locked.rows !== now.rows) issues.push({ table: name, kind: "changed", locked, current: now });
  }
  if (!used && lock) {
    for (const [name, locked] of Object.entries(lock.tables)) if (!current[name]) issues.push({ table: name, kind: "stale", locked });
  }
  return issues;
}

/** One line for a lock issue, naming the table and what to run. */
export function lockIssueProblem(issue: LockIssue): Problem {
  const fix = "run `tablegate ref lock` and commit the lock";
  switch (issue.kind) {
    case "no-lock":
      return { file: LOCK_FILE, message: `table "${issue.table}" is not locked: there is no lock file; ${fix}` };
    case "unlocked":
      return { file: LOCK_FILE, message: `table "${issue.table}" is not in the lock; ${fix}` };
    case "stale":
      return { file: LOCK_FILE, message: `table "${issue.table}" is in the lock but not in the registry; ${fix}` };
    case "changed": {
      const l = issue.locked, c = issue.current;
      const what: string[] = [];
      if (l && c && l.version !== c.version) what.push(`version ${l.version} -> ${c.version}`);
      if (l && c && l.rows !== c.rows) what.push(`rows ${l.rows} -> ${c.rows}`);
      if (l && c && l.sha256 !== c.sha256) what.push("content differs");
      return { file: LOCK_FILE, message: `table "${issue.table}" does not match the lock (${what.join(", ")}); ${fix}` };
    }
  }
}

/**
 * Refuse when a table in use differs from the lock (one problem per table). Built-in tables and tables
 * not in the registry are skipped; lock entries for tables no longer in the registry do not block a run.
 */
export async function verifyLock(repoRoot: string, registry: Registry, used?: readonly string[]): Promise<Result<void>> {
  const lock = await readLock(repoRoot);
  if (!lock.ok) return lock;
  const issues = compareLock(lock.value, registry, used).filter((i) => i.kind !== "stale");
  return issues.length > 0 ? fail(...issues.map(lockIssueProblem)) : ok(undefined);
}

/** Write the lock the registry calls for; `changed` tells whether the file's content changed. */
export async function writeLock(repoRoot: string, registry: Registry): Promise<Result<{ lock: Lock; changed: boolean }>> {
  const lock = computeLock(registry);
  const text = renderLock(lock);
  const path = join(repoRoot, LOCK_FILE);
  const linked = await lockLinkedOut(repoRoot);
  if (linked !== undefined) return fail({ file: LOCK_FILE, message: `lock ${linked}` });
  let before: string | undefined;
  try {
    before = await readFile(path, "utf8");
  } catch {
    before = undefined;
  }
  if (before === text) return ok({ lock, changed: false });
  try {
    await mkdir(dirname(path), { recursive: true });
  } catch {
    return fail({ file: LOCK_FILE, message: "cannot write the lock" });
  }
  const written = await writeWholeFile(path, text);
  if (!written.ok) return fail({ file: LOCK_FILE, message: "cannot write the lock" });
  return ok({ lock, changed: true });
}

/** Why the lock, or the folder it lives in, leads out of the repository through a link; undefined when it does not. */
async function lockLinkedOut(repoRoot: string): Promise<string | undefined> {
  return (await linkOutReason(repoRoot, dirname(LOCK_FILE))) ?? (await linkOutReason(repoRoot, LOCK_FILE));
}
