import { realpath } from "node:fs/promises";
import { isAbsolute, relative, resolve, sep } from "node:path";

/** A path as shown to users: relative to the repository root, with forward slashes. */
export function repoLabel(repoRoot: string, abs: string): string {
  const rel = relative(repoRoot, abs);
  return rel.split(sep).join("/");
}

/** True when `child` is `parent` or lies beneath it (both absolute, already resolved). */
export function isInside(parent: string, child: string): boolean {
  const rel = relative(parent, child);
  return rel === "" || (!rel.startsWith("..") && !isAbsolute(rel));
}

/** Resolve `rel` under `base`, following symbolic links; says so when it is missing or lands outside `base`. */
export async function resolveInside(base: string, rel: string): Promise<{ abs: string } | { missing: true } | { escapes: true }> {
  const lexical = resolve(base, rel);
  if (!isInside(base, lexical)) return { escapes: true };
  let real: string;
  let realBase: string;
  try {
    [real, realBase] = await Promise.all([realpath(lexical), realpath(base)]);
  } catch {
    return { missing: true };
  }
  return isInside(realBase, real) ? { abs: real } : { escapes: true };
}
