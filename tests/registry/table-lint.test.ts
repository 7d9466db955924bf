import { describe, expect, it } from "vitest";
import { parseCsvTable, parseManifest } from "../../src/registry/index.js";
import { COLORS_YAML } from "./helpers.js";

function problems(csv: string): { line?: number; message: string }[] {
  const m = parseManifest(COLORS_YAML, "registry.yaml");
  if (!m.ok || !m.value[0]) throw new Error("manifest");
  const t = parseCsvTable(m.value[0], new TextEncoder().encode(csv), { file: "colors.csv", manifestFile: "registry.yaml", builtIn: false });
  return t.ok ? [] : t.problems.map((p) => ({ line: p.line, message: p.message }));
}

describe("table checks on load", () => {
  it("a key of only spaces is one problem, a blank key, not a spaces problem", () => {
    const found = problems("code,name,rank\nRED,Red,1\n   ,Nothing,2\n");
    expect(found.map((p) => p.line)).toEqual([3]);
    expect(found[0]?.message).toContain("blank");
  });

  it("a padded key that is not blank is a spaces problem", () => {
    const found = problems("code,name,rank\nRED ,Red,1\n");
    expect(found.map((p) => p.line)).toEqual([2]);
    expect(found[0]?.message).toContain("spaces");
  });
});

describe("line breaks in a table", () => {
  // RFC 4180 §2 rule 1 ends records with CRLF; a table edited on two systems also has bare LF and CR
  // lines, which end records as they do in deliveries (README "Reading deliveries").
  it("CRLF, LF and CR lines mixed are read as one record each, problems on the right line", () => {
    expect(problems("code,name,rank\r\nRED,Red,1\nGRN,Green,2\rBLU ,Blue,3\r\n")).toEqual([{ line: 4, message: expect.stringContaining("spaces") }]);
  });
});
