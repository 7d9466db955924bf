import { mkdir, writeFile } from "node:fs/promises";
import { dirname, join } from "node:path";
import { run } from "../../src/cli/run.js";
import { tempDir } from "../helpers/temp-dir.js";

/** A fresh temporary folder with the given files (paths relative to it). */
export async function tempRepo(files: Record<string, string | Uint8Array>): Promise<string> {
  const root = tempDir("tg-registry-");
  for (const [path, text] of Object.entries(files)) {
    await mkdir(dirname(join(root, path)), { recursive: true });
    await writeFile(join(root, path), text);
  }
  return root;
}

export const COLORS_YAML = `tables:
  colors:
    file: colors.csv
    key: code
    version: "1.0"
    source: invented for tests
    columns:
      code: text
      name: text
      rank: integer
`;

export const COLORS_CSV = "code,name,rank\nRED,Red,1\nGRN,Green,2\nBLU,Blue,3\n";

/** `tablegate <argv>` run in-process in `cwd`, colour off; its exit status and what it wrote. */
export async function tablegate(cwd: string, ...argv: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = "";
  let err = "";
  const code = await run(argv, { stdout: (s) => (out += s), stderr: (s) => (err += s), env: { NO_COLOR: "1" }, cwd });
  return { code, out, err };
}
