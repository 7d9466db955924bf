import { randomBytes } from "node:crypto";
import { lstat, open, rename, rm, writeFile, type FileHandle } from "node:fs/promises";
import { basename, dirname, join } from "node:path";
import { fail, ok, type Result } from "./problem.js";

/** Text written to a temporary file beside its target, which replaces the target only on `commit`. */
export interface AtomicFile {
  readonly path: string;
  /** The temporary file, readable once `flush` has run. */
  readonly temp: string;
  /** Buffer text; `flush` writes it out. */
  write(text: string): void;
  /** Write out what is buffered, keeping the file open. */
  flush(): Promise<void>;
  /** Close and rename over the target. */
  commit(): Promise<Result<void>>;
  /** Close and remove the temporary file; the target is left untouched. */
  discard(): Promise<void>;
}

/**
 * Open a temporary file in the target's folder (a rename is atomic only within one file system),
 * created with `mode` so data is never more readable than the delivery it came from.
 */
export async function createAtomicFile(path: string, mode: number): Promise<Result<AtomicFile>> {
  const temp = join(dirname(path), `.${basename(path)}.${process.pid}-${randomBytes(4).toString("hex")}.tmp`);
  let handle: FileHandle;
  try {
    handle = await open(temp, "wx", mode);
  } catch (e) {
    return fail({ file: path, message: `cannot be written: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}` });
  }
  let buffered = "";
  let closed = false;
  const flush = async () => {
    if (buffered === "") return;
    const text = buffered;
    buffered = "";
    await handle.write(text, null, "utf8");
  };
  const close = async () => {
    if (closed) return;
    closed = true;
    await handle.close();
  };
  return ok({
    path,
    temp,
    write(text) {
      buffered += text;
    },
    flush,
    async commit() {
      try {
        await flush();
        await close();
        await rename(temp, path);
        return ok(undefined);
      } catch (e) {
        await rm(temp, { force: true }).catch(() => undefined);
        return fail({ file: path, message: `cannot be written: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}` });
      }
    },
    async discard() {
      await close().catch(() => undefined);
      await rm(temp, { force: true }).catch(() => undefined);
    },
  });
}

/**
 * Write `text` as the whole of `path` through a temporary file and a rename, so a symbolic link at
 * `path` (a pull request can add one) is replaced, never followed, and a reader never sees half a file.
 * A device or pipe already there (`/dev/stderr`) is written directly: renaming over it is impossible.
 */
export async function writeWholeFile(path: string, text: string): Promise<Result<void>> {
  const there = await lstat(path).catch(() => undefined);
  if (there !== undefined && !there.isFile() && !there.isSymbolicLink() && !there.isDirectory()) {
    try {
      await writeFile(path, text);
      return ok(undefined);
    } catch (e) {
      return fail({ file: path, message: `cannot be written: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}` });
    }
  }
  const file = await createAtomicFile(path, 0o666);
  if (!file.ok) return file;
  file.value.write(text);
  return file.value.commit();
}
