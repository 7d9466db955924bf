import { mkdir, mkdtemp, readFile, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { parse } from "csv-parse/sync";
import { afterEach } from "vitest";
import { run } from "../../src/cli/run.js";

/** One in-process run of the command line inside a project folder. */
export interface Ran {
  readonly code: number;
  readonly stdout: string;
  readonly stderr: string;
}

/** A temporary project folder (with an empty .git, so it is the root) in which several commands run in turn. */
export interface Project {
  readonly dir: string;
  run(argv: readonly string[]): Promise<Ran>;
  read(name: string): Promise<string>;
  bytes(name: string): Promise<Buffer>;
  exists(name: string): Promise<boolean>;
  write(name: string, content: string | Uint8Array): Promise<void>;
  remove(): Promise<void>;
}

/** Lay out `files` in a fresh temporary project. */
export async function project(files: Readonly<Record<string, string | Uint8Array>>): Promise<Project> {
  const dir = await mkdtemp(join(tmpdir(), "tablegate-fix-"));
  await mkdir(join(dir, ".git"));
  const write = async (name: string, content: string | Uint8Array) => {
    await mkdir(dirname(join(dir, name)), { recursive: true });
    await writeFile(join(dir, name), content);
  };
  for (const [name, content] of Object.entries(files)) await write(name, content);
  return {
    dir,
    async run(argv) {
      let stdout = "";
      let stderr = "";
      const code = await run(argv, { stdout: (s) => { stdout += s; }, stderr: (s) => { stderr += s; }, env: { NO_COLOR: "1" }, cwd: dir, stderrIsTty: false });
      return { code, stdout, stderr };
    },
    read: (name) => readFile(join(dir, name), "utf8"),
    bytes: (name) => readFile(join(dir, name)),
    exists: (name) => readFile(join(dir, name)).then(() => true, () => false),
    write,
    remove: () => rm(dir, { recursive: true, force: true }),
  };
}

/** The usual `fix` arguments: delivery d.csv, contract c.yaml, outputs out.csv, rejects.csv, log.ndjson. */
export const FIX_ARGS = ["fix", "d.csv", "--contract", "c.yaml", "--out", "out.csv", "--rejects", "rejects.csv", "--log", "log.ndjson"] as const;

/** One line of the change log. */
export interface LogEntry {
  readonly row: number;
  readonly line: number;
  readonly column?: string;
  readonly repair?: string;
  readonly before?: string;
  readonly after?: string;
  readonly masked?: boolean;
  readonly rejected?: boolean;
  readonly rules?: string[];
}

/** The NDJSON log, one object a line. */
export const logEntries = (text: string): LogEntry[] => text.split("\n").filter((l) => l !== "").map((l) => JSON.parse(l) as LogEntry);

/** Records of a CSV text, read by csv-parse (not by tablegate's own reader). */
export const records = (text: string, delimiter = ","): string[][] => parse(text, { delimiter, relax_column_count: true }) as string[][];

/** Run fix over one delivery and contract; return the project (caller removes it), the run and the three outputs. */
export async function fixRun(contract: string, data: string | Uint8Array, extra: Readonly<Record<string, string>> = {}) {
  const p = await project({ "c.yaml": contract, "d.csv": data, ...extra });
  const ran = await p.run(FIX_ARGS);
  const out = (await p.exists("out.csv")) ? await p.read("out.csv") : undefined;
  const rejects = (await p.exists("rejects.csv")) ? await p.read("rejects.csv") : undefined;
  const log = (await p.exists("log.ndjson")) ? await p.read("log.ndjson") : undefined;
  return { p, ran, out, rejects, log };
}

/** A list to push every project a test opens onto; each is removed after its test. */
export function removedAfterEach(): Project[] {
  const opened: Project[] = [];
  afterEach(async () => {
    for (const p of opened.splice(0)) await p.remove();
  });
  return opened;
}
