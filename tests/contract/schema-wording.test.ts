/**
 * SPEC §3: every contract error names the file, line and column and says what is allowed there. These
 * cases reach each JSON Schema keyword the contract schema uses; each must give one problem at the
 * right place, in plain words (none of the schema validator's own "must NOT have ..." phrasing), naming
 * the key words asserted below. Positions were counted by hand from the YAML text (1-based).
 */
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { compileContract } from "../../src/contract/load.js";
import { WORDED_KEYWORDS } from "../../src/contract/schema-errors.js";
import type { Problem } from "../../src/problem.js";
import type { Registry } from "../../src/registry/index.js";

const NO_TABLES: Registry = { table: () => undefined, tables: () => [] };
const head = "tablegate: 1\nname: broken\n";
const cols = "columns:\n  a: { type: integer }\n";

function problems(text: string): readonly Problem[] {
  const r = compileContract("c.yaml", text, { registry: NO_TABLES });
  return r.ok ? [] : r.problems;
}

// The schema validator's own phrasing, which says what failed rather than what to write.
const RAW = /must NOT have|must match pattern|must be equal to|must be (?:>=|<=|>|<)|must have required/;

interface Case {
  readonly name: string;
  readonly contract: string;
  readonly at: readonly [line: number, column: number];
  /** Words the one message must contain (what was found and what is allowed). */
  readonly says: readonly string[];
}

const cases: readonly Case[] = [
  { name: "minLength: an empty assert", contract: head + cols + 'rules:\n  - { id: r1, assert: "" }\n', at: [6, 23], says: ["expression", "condition"] },
  { name: "minLength: an empty when", contract: head + cols + 'rules:\n  - { id: r1, when: "", assert: "a > 0" }\n', at: [6, 21], says: ["condition", "when"] },
  { name: "minLength: an empty column in keys", contract: head + cols + 'keys: [""]\n', at: [5, 8], says: ["column"] },
  { name: "minProperties: columns lists none", contract: head + "columns: {}\n", at: [3, 10], says: ["columns", "at least one"] },
  { name: "maxLength: a two-character delimiter", contract: head + 'input: { delimiter: ";;" }\n' + cols, at: [3, 21], says: ["delimiter", "one character", '";;"'] },
  { name: "minLength: an empty quote", contract: head + "input: { quote: '' }\n" + cols, at: [3, 17], says: ["quote", "one character"] },
  { name: "type: version written as a number", contract: head + "version: 1.0\n" + cols, at: [3, 10], says: ['"1.0.0"', "1.0", "quote", "number"] },
  { name: "type: a key with nothing after it", contract: head + "version:\n" + cols, at: [3, 9], says: ["text", "nothing", "leave the key out"] },
  { name: "pattern: a version with two parts", contract: head + 'version: "1.0"\n' + cols, at: [3, 10], says: ['"1.0.0"', '"1.0"'] },
  { name: "pattern: a dataset name with capitals", contract: "tablegate: 1\nname: Stock List\n" + cols, at: [2, 7], says: ["lower-case", '"Stock List"'] },
  { name: "pattern: a rule id with capitals", contract: head + cols + "rules:\n  - { id: R1, assert: 'a > 0' }\n", at: [6, 11], says: ["lower-case", '"R1"'] },
  { name: "type: text given true", contract: head + "description: true\n" + cols, at: [3, 14], says: ["text", "true", "quote"] },
  { name: "minimum: a negative scale", contract: head + "columns:\n  a: { type: decimal, scale: -1 }\n", at: [4, 30], says: ["whole number", "0 or more", "-1"] },
  { name: "maximum: allow above 1", contract: head + "columns:\n  a: { type: integer, allow: 1.5 }\n", at: [4, 30], says: ["0 to 1", "1.5"] },
  { name: "minimum: a negative blank share", contract: head + cols + "totals:\n  blank_share: { a: -0.5 }\n", at: [6, 21], says: ["0 to 1", "-0.5"] },
  { name: "exclusiveMinimum: outlier k of 0", contract: head + cols + "outliers:\n  - { column: a, method: tukey, k: 0 }\n", at: [6, 36], says: ["greater than 0"] },
  { name: "const: another contract language version", contract: "tablegate: 2\nname: broken\n" + cols, at: [1, 12], says: ["1", "2", "version"] },
  { name: "enum: an unknown column type", contract: head + "columns:\n  a: { type: txt }\n", at: [4, 14], says: ['"txt"', "text"] },
  { name: "minItems: an empty codes list", contract: head + "columns:\n  a: { type: text, codes: [] }\n", at: [4, 27], says: ["empty", "list"] },
  { name: "required: a rule without its assert", contract: head + cols + "rules:\n  - { id: r1 }\n", at: [6, 5], says: ['"assert"'] },
];

describe("contract schema errors say what is allowed", () => {
  for (const c of cases) {
    it(c.name, () => {
      const found = problems(c.contract);
      expect(found.map((p) => [p.line, p.column])).toEqual([c.at]);
      const message = found[0]?.message ?? "";
      expect(message).not.toMatch(RAW);
      for (const w of c.says) expect(message).toContain(w);
    });
  }

  it("every keyword the contract schema can fail on has its own wording", () => {
    // Keywords that only annotate or point elsewhere never fail on their own.
    const QUIET = new Set(["$schema", "$id", "$defs", "$ref", "title", "description", "properties", "items"]);
    const used = new Set<string>();
    const walk = (node: unknown, inProperties: boolean): void => {
      if (Array.isArray(node)) return node.forEach((n) => walk(n, false));
      if (node === null || typeof node !== "object") return;
      for (const [k, v] of Object.entries(node)) {
        if (!inProperties) used.add(k);
        walk(v, !inProperties && (k === "properties" || k === "$defs"));
      }
    };
    walk(JSON.parse(readFileSync(new URL("../../src/schema/contract.schema.json", import.meta.url), "utf8")), false);
    const unworded = [...used].filter((k) => !QUIET.has(k) && !WORDED_KEYWORDS.has(k));
    expect(unworded).toEqual([]);
    expect(used.has("minLength") && used.has("pattern")).toBe(true);
  });
});

describe("one typo, one message", () => {
  it("a misspelt required key is reported once, at the unknown key, naming the right one", () => {
    const found = problems(head + "columns:\n  ok: { type: boolean, values: { true: [Y], flase: [N] } }\n");
    expect(found.map((p) => [p.line, p.column])).toEqual([[4, 45]]);
    expect(found[0]?.message).toContain('"flase"');
    expect(found[0]?.message).toContain('"false"');
    expect(found[0]?.message).not.toContain("missing");
  });

  it("in a rule too: a swapped pair of letters in assert", () => {
    const found = problems(head + cols + "rules:\n  - { id: r1, asesrt: 'a > 0' }\n");
    expect(found.map((p) => [p.line, p.column])).toEqual([[6, 15]]);
    expect(found[0]?.message).toContain('"assert"');
  });

  it("an unknown key that is no typo of the missing one: both are reported", () => {
    const found = problems(head + "columns:\n  ok: { type: boolean, values: { true: [Y], no: [N] } }\n");
    expect(found).toHaveLength(2);
    expect(found.map((p) => p.message).join("\n")).toContain('"false"');
    expect(found.map((p) => p.message).join("\n")).toContain('"no"');
  });
});

describe("codes and bounds name the type with the right article", () => {
  it('"an integer value", "an integer column"', () => {
    const codes = problems(head + "columns:\n  n: { type: integer, codes: [1, two] }\n");
    expect(codes.map((p) => [p.line, p.column])).toEqual([[4, 34]]);
    expect(codes[0]?.message).toContain("an integer value");
    const bound = problems(head + 'columns:\n  n: { type: integer, min: "abc" }\n');
    expect(bound[0]?.message).toContain("an integer column");
  });

  it('"a decimal value"', () => {
    const codes = problems(head + "columns:\n  n: { type: decimal, codes: [1.5, two] }\n");
    expect(codes[0]?.message).toContain("a decimal value");
  });
});
