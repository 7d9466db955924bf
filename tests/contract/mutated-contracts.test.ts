/**
 * A contract mangled the ways hands mangle YAML (a character lost or doubled, a stray quote, bracket,
 * colon, tab or line break, a line moved) is never an exception: it compiles, or every problem names a
 * line and column inside the file. Seeded, so the same mutations run every time.
 */
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { mulberry32 } from "../../src/bench/prng.js";
import { compileContract } from "../../src/contract/load.js";
import { loadRegistry } from "../../src/registry/index.js";

const ROOT = fileURLToPath(new URL("../../", import.meta.url));
const demo = readFileSync(`${ROOT}contracts/dealer-sales.contract.yaml`, "utf8");
const STRAY = [":", '"', "'", "{", "}", "[", "]", "-", " ", "  ", "\t", "\n", "#", "&a", "*a", "!", "|", ">", ",", "%", "("];

function mutate(text: string, next: () => number): string {
  const at = Math.floor(next() * text.length);
  const kind = Math.floor(next() * 4);
  if (kind === 0) return text.slice(0, at) + text.slice(at + 1);
  if (kind === 1) return text.slice(0, at) + (STRAY[Math.floor(next() * STRAY.length)] ?? "") + text.slice(at);
  if (kind === 2) return text.slice(0, at) + text.slice(at, at + 1) + text.slice(at);
  const lines = text.split("\n");
  const from = Math.floor(next() * lines.length);
  const [moved] = lines.splice(from, 1);
  lines.splice(Math.floor(next() * lines.length), 0, moved ?? "");
  return lines.join("\n");
}

describe("mutated demo contracts", () => {
  it("compile or report problems inside the file, 400 mutations", async () => {
    const registry = await loadRegistry(ROOT, []);
    if (!registry.ok) throw new Error("registry");
    const next = mulberry32(20261202);
    let refused = 0;
    for (let i = 0; i < 400; i++) {
      let text = demo;
      for (let k = 1 + Math.floor(next() * 2); k > 0; k--) text = mutate(text, next);
      const lineCount = text.split("\n").length;
      const r = compileContract("c.yaml", text, { registry: registry.value, today: 20_000 });
      if (r.ok) continue;
      refused++;
      for (const p of r.problems) {
        const where = `mutation ${i}: ${p.line}:${p.column} ${p.message}`;
        expect(p.line, where).toBeGreaterThanOrEqual(1);
        expect(p.line, where).toBeLessThanOrEqual(lineCount);
        expect(p.column, where).toBeGreaterThanOrEqual(1);
        expect(p.message, where).not.toMatch(/internal error|undefined|\[object/);
      }
    }
    // Most single slips break something; a run where nothing was refused would test nothing.
    expect(refused).toBeGreaterThan(100);
  });
});
