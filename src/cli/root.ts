import { existsSync } from "node:fs";
import { dirname, join, relative, resolve, sep } from "node:path";

/**
 * The repository root: the nearest folder at or above `cwd` holding tablegate.yaml, a .git entry or a
 * reference/registry.yaml; `cwd` itself when there is none.
 */
export function findRoot(cwd: string): string {
  let dir = resolve(cwd);
  for (;;) {
    if (["tablegate.yaml", ".git", join("reference", "registry.yaml")].some((m) => existsSync(join(dir, m)))) return dir;
    const up = dirname(dir);
    if (up === dir) return resolve(cwd);
    dir = up;
  }
}

/** A path as reports show it: relative to the root when inside it, '/' separated. */
export function reportPath(root: string, path: string): string {
  const rel = relative(root, resolve(path));
  const inside = rel !== "" && !rel.startsWith("..") && !resolve(rel).startsWith("..");
  return (inside ? rel : resolve(path)).split(sep).join("/");
}
