import { mkdir, mkdtemp, readFile, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { run } from "../../src/cli/run.js";
import type { DeliveryReport } from "../../src/report/model.js";

/** What one in-process run of the command line produced. */
export interface CliRun {
  readonly code: number;
  readonly stdout: string;
  readonly stderr: string;
  /** Contents of the files named in `readBack` after the run; absent files are left out. */
  readonly files: Readonly<Record<string, string>>;
}

/** Extra settings for one run. */
export interface RunOptions {
  /** Files to read back after the run (e.g. reports written with --report fmt=path). */
  readonly readBack?: readonly string[];
  readonly env?: Readonly<Record<string, string | undefined>>;
  readonly stderrIsTty?: boolean;
  /** The command line to run: the sources by default, or the built package's (tests/input/parse-thread). */
  readonly run?: typeof run;
}

/** Files to lay out in the temporary project folder: relative path to content. */
export type FileSet = Readonly<Record<string, string | Uint8Array>>;

/**
 * Run `tablegate <argv>` in-process inside a fresh temporary folder holding `files` (and an empty
 * `.git`, so that folder is the project root), capture stdout/stderr and the exit status, then remove it.
 */
export async function runCli(argv: readonly string[], files: FileSet = {}, options: RunOptions = {}): Promise<CliRun> {
  const dir = await mkdtemp(join(tmpdir(), "tablegate-test-"));
  try {
    await mkdir(join(dir, ".git"));
    for (const [name, content] of Object.entries(files)) {
      const path = join(dir, name);
      await mkdir(dirname(path), { recursive: true });
      await writeFile(path, content);
    }
    let stdout = "";
    let stderr = "";
    const code = await (options.run ?? run)(argv, {
      stdout: (s) => { stdout += s; },
      stderr: (s) => { stderr += s; },
      env: options.env ?? { NO_COLOR: "1" },
      cwd: dir,
      stderrIsTty: options.stderrIsTty ?? false,
    });
    const back: Record<string, string> = {};
    for (const name of options.readBack ?? []) {
      try {
        back[name] = await readFile(join(dir, name), "utf8");
      } catch {
        // left out: the test asserts on presence
      }
    }
    return { code, stdout, stderr, files: back };
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

/** `check <dataName> --contract contract.yaml --report json=-` over the given texts; the report parsed. */
export async function checkJson(
  contract: string,
  data: string | Uint8Array,
  extraArgs: readonly string[] = [],
  dataName = "data.csv",
): Promise<CliRun & { readonly report: DeliveryReport }> {
  const r = await runCli(["check", dataName, "--contract", "contract.yaml", "--report", "json=-", ...extraArgs], {
    "contract.yaml": contract,
    [dataName]: data,
  });
  let report: DeliveryReport;
  try {
    report = JSON.parse(r.stdout) as DeliveryReport;
  } catch {
    throw new Error(`no JSON report on stdout (exit ${r.code}); stderr: ${r.stderr}`);
  }
  return { ...r, report };
}
