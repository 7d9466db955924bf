import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { expect } from "vitest";

const dir = join(import.meta.dirname, "..", "golden-writers");

/** Compares output with tests/golden-writers/<name>; TABLEGATE_UPDATE_GOLDEN=1 rewrites the file after review. */
export function expectGolden(name: string, actual: string): void {
  const path = join(dir, name);
  if (process.env.TABLEGATE_UPDATE_GOLDEN === "1" || !existsSync(path)) writeFileSync(path, actual);
  expect(actual).toBe(readFileSync(path, "utf8"));
}
