import { mkdirSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import { createRequire } from "node:module";
import { basename, join } from "node:path";
import { describe, expect, it } from "vitest";
import { parse } from "yaml";
import { schemaValidator, writeStandaloneValidators } from "../../src/schema/validator.js";

const require = createRequire(import.meta.url);

// The built tool validates with standalone code that ajv generates at build time; tests run from src
// and use ajv directly. Both must agree on every contract we have, valid or broken.
describe("standalone schema validators", () => {
  // Inside the project, so the generated code's require("ajv/dist/runtime/...") finds node_modules.
  mkdirSync(join(process.cwd(), "node_modules", ".cache"), { recursive: true });
  const dir = mkdtempSync(join(process.cwd(), "node_modules", ".cache", "tg-standalone-"));
  const built = new Map<string, (data: unknown) => boolean>();
  writeStandaloneValidators((file, code) => {
    const target = join(dir, basename(file));
    writeFileSync(target, code);
    built.set(basename(file).replace(".validate.cjs", ""), (require(target) as { default: (d: unknown) => boolean }).default);
  });

  it("are written for the contract, registry and project schemas", () => {
    expect([...built.keys()].sort()).toEqual(["contract", "project", "registry"]);
  });

  const goldenDir = join(process.cwd(), "tests/golden");
  const contracts = readdirSync(goldenDir, { withFileTypes: true })
    .filter((d) => d.isDirectory())
    .map((d) => readFileSync(join(goldenDir, d.name, "contract.yaml"), "utf8"));
  const broken = [
    "tablegate: 1\nname: x\ncolumns: {}\n",
    "tablegate: 2\nname: x\ncolumns:\n  a: { type: text }\n",
    "tablegate: 1\nname: X\ncolumns:\n  a: { type: txt }\n",
    "tablegate: 1\nname: x\ncolumns:\n  a: { type: text, codes: US }\n",
    "tablegate: 1\nname: x\ncolumns:\n  a: { type: integer, min: [1] }\nextra: 1\n",
  ];

  it("agree with ajv at run time on every golden contract and on broken ones", () => {
    const fast = built.get("contract");
    const runtime = schemaValidator("contract");
    expect(fast).toBeDefined();
    for (const text of [...contracts, readFileSync("contracts/dealer-sales.contract.yaml", "utf8"), ...broken]) {
      const data: unknown = parse(text);
      expect(fast?.(data)).toBe(runtime.valid(data));
    }
    expect(broken.every((t) => fast?.(parse(t)) === false)).toBe(true);
  });
});
