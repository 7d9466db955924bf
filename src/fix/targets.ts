import { stat } from "node:fs/promises";
import { resolve } from "node:path";
import type { Problem, Result } from "../problem.js";

/** Where `fix` writes: the repaired passing records, the rejected records as given, and the change log. */
export interface FixTargets {
  readonly out: string;
  readonly rejects: string;
  readonly log: string;
}

/** The same file on disk (a link or another spelling of the path included), when both exist. */
async function sameFile(a: string, b: string): Promise<boolean> {
  if (resolve(a) === resolve(b)) return true;
  const [x, y] = await Promise.all([stat(a).catch(() => undefined), stat(b).catch(() => undefined)]);
  return x !== undefined && y !== undefined && x.dev === y.dev && x.ino === y.ino;
}

/**
 * Refuse output paths that would overwrite the delivery or each other, or that name a gzip file
 * (outputs are written uncompressed). `names` says how each option is spelled in messages.
 */
export async function checkTargets(input: string, targets: FixTargets, names: Readonly<Record<keyof FixTargets, string>>): Promise<Result<void>> {
  const problems: Problem[] = [];
  const keys = ["out", "rejects", "log"] as const;
  for (const [i, key] of keys.entries()) {
    const path = targets[key];
    if (await sameFile(path, input)) {
      problems.push({ file: names[key], message: `${path} is the delivery itself; fix never writes over its input` });
      continue;
    }
    if (path.endsWith(".gz")) problems.push({ file: names[key], message: `${path} names a gzip file; fix writes uncompressed files` });
    for (const other of keys.slice(i + 1)) {
      if (await sameFile(path, targets[other])) problems.push({ file: names[key], message: `${path} is also given as ${names[other]}; each output needs its own file` });
    }
  }
  return problems.length > 0 ? { ok: false, problems } : { ok: true, value: undefined };
}
