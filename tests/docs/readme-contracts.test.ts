/**
 * The README is what a new user copies from: every contract it shows (a YAML block with top-level
 * `columns:`) must be one the tool accepts, against this repository's registry.
 */
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { compileContract } from "../../src/contract/load.js";
import { loadRegistry } from "../../src/registry/index.js";

const ROOT = fileURLToPath(new URL("../../", import.meta.url));
const readme = readFileSync(`${ROOT}README.md`, "utf8");
const contracts = [...readme.matchAll(/```yaml\n([\s\S]*?)```/g)].map((m) => m[1] ?? "").filter((block) => /^columns:/m.test(block));

describe("contracts shown in the README", () => {
  it("there are some", () => {
    expect(contracts.length).toBeGreaterThan(0);
  });

  it.each(contracts.map((text, i) => [i + 1, text] as const))("contract %i compiles", async (_n, text) => {
    const registry = await loadRegistry(ROOT, []);
    if (!registry.ok) throw new Error(registry.problems.map((p) => p.message).join("; "));
    const compiled = compileContract("README.md", text, { registry: registry.value });
    expect(compiled.ok ? [] : compiled.problems.map((p) => `${p.line}:${p.column} ${p.message}`)).toEqual([]);
  });
});
