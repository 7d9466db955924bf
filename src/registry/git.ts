import { execFile } from "node:child_process";
import { posix } from "node:path";
import { fail, ok, type Result } from "../problem.js";
import { parseCsvTable, sha256Hex } from "./csv-table.js";
import { REPO_MANIFEST } from "./load.js";
import { parseManifest } from "./manifest.js";
import type { RefTable } from "./ref-table.js";

/** Revisions we pass to git: names, hashes and ~ ^ @{..} suffixes; never an option (leading '-'). */
const REV = /^[A-Za-z0-9_./~^@{}][A-Za-z0-9_./~^@{}+-]*$/;

/** A repository-relative path that stays inside the repository, in git's forward-slash form; undefined otherwise. */
function cleanRepoPath(path: string): string | undefined {
  const p = posix.normalize(path.replace(/\\/g, "/"));
  if (p.startsWith("/") || p === ".." || p.startsWith("../") || p === "." || p.includes("\0")) return undefined;
  return p;
}

function git(repoRoot: string, args: readonly string[]): Promise<{ ok: true; out: Buffer } | { ok: false; err: string }> {
  return new Promise((done) => {
    execFile("git", [...args], { cwd: repoRoot, encoding: "buffer", maxBuffer: 256 * 1024 * 1024, windowsHide: true }, (error, stdout, stderr) => {
      if (error) done({ ok: false, err: stderr.toString("utf8").split("\n", 1)[0] || error.message });
      else done({ ok: true, out: stdout });
    });
  });
}

/** The bytes of a repository file at a git revision (`git show <rev>:<path>`, no shell). */
export async function readAtRevision(repoRoot: string, rev: string, path: string): Promise<Result<Buffer>> {
  if (!REV.test(rev)) return fail({ file: "(arguments)", message: `"${rev}" is not a git revision` });
  const p = cleanRepoPath(path);
  if (p === undefined) return fail({ file: path, message: "path lies outside the repository" });
  // "./" makes git read the path relative to cwd (the repository root given), not to git's top level.
  const r = await git(repoRoot, ["show", `${rev}:./${p}`]);
  return r.ok ? ok(r.out) : fail({ file: `${rev}:${p}`, message: `cannot read at revision ${rev}: ${r.err}` });
}

/** Whether the registry at a git revision lists the table (false when it, or its manifest, was not there yet). */
export async function tableListedAtRevision(repoRoot: string, rev: string, name: string, manifest: string = REPO_MANIFEST): Promise<Result<boolean>> {
  if (!REV.test(rev)) return fail({ file: "(arguments)", message: `"${rev}" is not a git revision` });
  const m = cleanRepoPath(manifest);
  if (m === undefined) return fail({ file: manifest, message: "path lies outside the repository" });
  const exists = await git(repoRoot, ["cat-file", "-e", `${rev}:./${m}`]);
  if (!exists.ok) {
    const revOk = await git(repoRoot, ["rev-parse", "--verify", "--quiet", `${rev}^{commit}`]);
    return revOk.ok ? ok(false) : fail({ file: "(arguments)", message: `"${rev}" is not a git revision here` });
  }
  const text = await readAtRevision(repoRoot, rev, m);
  if (!text.ok) return text;
  const parsed = parseManifest(text.value.toString("utf8"), `${rev}:${m}`);
  return parsed.ok ? ok(parsed.value.some((e) => e.name === name)) : parsed;
}

/**
 * A table as it was at a git revision: its manifest entry and CSV read from that revision and checked as
 * on load. `manifest` is the repository-relative registry.yaml the table is listed in.
 */
export async function tableAtRevision(repoRoot: string, rev: string, name: string, manifest: string = REPO_MANIFEST): Promise<Result<RefTable>> {
  const m = cleanRepoPath(manifest);
  if (m === undefined) return fail({ file: manifest, message: "path lies outside the repository" });
  const text = await readAtRevision(repoRoot, rev, m);
  if (!text.ok) return text;
  const label = `${rev}:${m}`;
  const parsed = parseManifest(text.value.toString("utf8"), label);
  if (!parsed.ok) return parsed;
  const entry = parsed.value.find((e) => e.name === name);
  if (!entry) return fail({ file: label, message: `table "${name}" is not in the registry at ${rev}` });
  const csvPath = cleanRepoPath(posix.join(posix.dirname(m), entry.file));
  if (csvPath === undefined || !csvPath.startsWith(posix.dirname(m) === "." ? "" : posix.dirname(m) + "/")) {
    return fail({ file: label, line: entry.at.file.line, column: entry.at.file.column, message: `table "${name}": file lies outside the registry folder` });
  }
  const bytes = await readAtRevision(repoRoot, rev, csvPath);
  if (!bytes.ok) return bytes;
  return parseCsvTable(entry, bytes.value, { file: `${rev}:${csvPath}`, manifestFile: label, builtIn: false });
}

/**
 * The most recent commit (among the last `depth` that touched the file, newest first) at which the
 * file's bytes hash to `sha256`: where the locked content of a table can be read back from.
 */
export async function revisionWithContent(repoRoot: string, path: string, sha256: string, depth = 200): Promise<Result<string | undefined>> {
  const p = cleanRepoPath(path);
  if (p === undefined) return fail({ file: path, message: "path lies outside the repository" });
  const log = await git(repoRoot, ["log", `-n${depth}`, "--format=%H", "--", `./${p}`]);
  if (!log.ok) return fail({ file: p, message: `cannot read git history: ${log.err}` });
  for (const commit of log.out.toString("utf8").split("\n").filter((l) => /^[0-9a-f]{40,64}$/.test(l))) {
    const bytes = await readAtRevision(repoRoot, commit, p);
    if (bytes.ok && sha256Hex(bytes.value) === sha256) return ok(commit);
  }
  return ok(undefined);
}
