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
 * Files changed since a git revision (committed or not, deletions left out), root-relative. The
 * revision goes to git as one argument, never through a shell.
 */
export function changedSince(root: string, rev: string): Promise<Result<string[]>> {
  return new Promise((resolve) => {
    if (rev.startsWith("-")) {
      resolve({ ok: false, problems: [{ file: "--changed-since", message: `not a git revision: ${rev}` }] });
      return;
    }
    execFile("git", ["diff", "--name-only", "--relative", "--no-renames", "--diff-filter=d", "-z", rev, "--"], { cwd: root, maxBuffer: 64 << 20 }, (err, stdout, stderr) => {
      if (err) {
        const why = String(stderr).split("\n")[0] || err.message;
        resolve({ ok: false, problems: [{ file: "--changed-since", message: `git could not list changes since ${rev}: ${why}` }] });
        return;
      }
      resolve({ ok: true, value: String(stdout).split("\0").filter(Boolean).sort() });
    });
  });
}
