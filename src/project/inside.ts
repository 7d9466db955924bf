import { realpath } from "node:fs/promises";
import { isAbsolute, resolve } from "node:path";
import { isInside as within } from "../registry/paths.js";

/**
 * Why a file the run is about to read must not be read, or undefined when it may be. Deliveries and
 * contracts can come from an untrusted pull request, which can add a symbolic link: a path inside the
 * repository must really lie inside it, or a report would print another file's lines. A path outside
 * the repository can only have been named on the command line by whoever runs tablegate, and is read.
 */
export async function linkOutReason(root: string, path: string): Promise<string | undefined> {
  const lexical = resolve(root, path);
  if (!within(root, lexical)) return undefined;
  let real: string;
  let realRoot: string;
  try {
    [real, realRoot] = await Promise.all([realpath(lexical), realpath(root)]);
  } catch {
    return undefined; // missing: opening it says so
  }
  return within(realRoot, real) ? undefined : "is a link to a file outside the repository; tablegate reads nothing outside it through a link";
}

/** True when a path written in a project file stays inside the repository: relative, no `..` above the root. */
export function staysInside(path: string): boolean {
  return !isAbsolute(path) && within(resolve("/r"), resolve("/r", path));
}
