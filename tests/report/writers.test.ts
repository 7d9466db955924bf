import { describe, expect, test } from "vitest";
import { WRITERS as writers } from "../../src/report/formats.js";
import { githubSummary } from "../../src/report/github-summary.js";
import { ctx, returns, sales } from "./fixture.js";

describe("writers by format name", () => {
  const names = Object.keys(writers).sort();

  test("one writer per --report format", () => {
    expect(names).toEqual(["codequality", "github", "html", "json", "junit", "sarif", "text"]);
  });

  test.each(names)("%s: same input, same bytes; elapsed time never printed", (name) => {
    const write = writers[name as keyof typeof writers];
    const a = write([sales, returns], ctx);
    expect(a.length).toBeGreaterThan(0);
    expect(write([sales, returns], ctx)).toBe(a);
    expect(write([{ ...sales, elapsed_ms: 987_654_321 }, returns], ctx)).toBe(a);
    expect(a).not.toContain("987654321");
    expect(a).not.toContain("elapsed");
  });

  test.each(names)("%s: masked values pass through as given, never unmasked", (name) => {
    const out = writers[name as keyof typeof writers]([sales], ctx);
    expect(out).toContain("d***@***.example");
  });

  test("an empty run is still well-formed", () => {
    expect(JSON.parse(writers.sarif([], ctx))).toMatchObject({ version: "2.1.0", runs: [{ results: [] }] });
    expect(JSON.parse(writers.codequality([], ctx))).toEqual([]);
    expect(writers.github([], ctx)).toBe("");
    expect(githubSummary([], ctx)).toContain("no deliveries were checked");
    expect(githubSummary([returns], ctx)).toContain("all deliveries meet their contracts");
    expect(writers.html([], ctx)).toContain("No deliveries were checked.");
  });
});
