import { execFile } from "node:child_process";
import { readdir } from "node:fs/promises";
import { join } from "node:path";
import type { Result } from "../problem.js";
import type { ProjectConfig } from "./config.js";

const SKIP = new Set(["node_modules", ".git", "dist"]);

/** Files below the root (root-relative, '/' separated, sorted) that some route's glob matches. */
export async function routedFiles(root: string, config: ProjectConfig): Promise<string[]> {
  const out: string[] = [];
  const walk = async (dir: string, rel: string): Promise<void> => {
    const entries = await readdir(dir, { withFileTypes: true }).catch(() => []);
    for (const e of entries) {
      const path = rel === "" ? e.name : `${rel}/${e.name}`;
      if (e.isDirectory()) {
        if (!SKIP.has(e.name)) await walk(join(dir, e.name), path);
      } else if (e.isFile() && config.routes.some((r) => r.matchers.some((m) => m.test(path)))) out.push(path);
    }
  };
  await walk(root, "");
  return out.sort();
}

/** Extensions that look like deliveries, for reporting changed files no contract claims. */
export const DATA_FILE = /\.(csv|tsv|txt|ndjson|jsonl|xlsx)(\.gz)?$/i;

/**
 * Files changed since a git revision (committed, staged, modified or new and untracked; deletions
 * left out), root-relative. The revision goes to git as one argument, never through a shell.
 */
export async function changedSince(root: string, rev: string): Promise<Result<string[]>> {
  if (rev.startsWith("-")) return { ok: false, problems: [{ file: "--changed-since", message: `not a git revision: ${rev}` }] };
  const changed = await git(root, ["diff", "--name-only", "--relative", "--no-renames", "--diff-filter=d", "-z", rev, "--"]);
  if (!changed.ok) return { ok: false, problems: [{ file: "--changed-since", message: `git could not list changes since ${rev}: ${changed.error}` }] };
  // New files not yet added to git are changes too (a local run before committing).
  const untracked = await git(root, ["ls-files", "--others", "--exclude-standard", "-z", "--", "."]);
  const all = new Set([...changed.out.split("\0"), ...(untracked.ok ? untracked.out.split("\0") : [])].filter(Boolean));
  return { ok: true, value: [...all].sort() };
}

function git(cwd: string, args: string[]): Promise<{ ok: true; out: string } | { ok: false; error: string }> {
  return new Promise((resolve) => {
    execFile("git", args, { cwd, maxBuffer: 64 << 20 }, (err, stdout, stderr) => {
      if (err) resolve({ ok: false, error: String(stderr).split("\n")[0] || err.message });
      else resolve({ ok: true, out: String(stdout) });
    });
  });
}
