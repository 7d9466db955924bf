import { describe, expect, test } from "vitest";
import { codequality } from "../../src/report/codequality.js";
import { bulk, ctx, returns, sales } from "./fixture.js";
import { expectGolden } from "./golden.js";

// The issue shape of GitLab's code quality report ("implement a custom tool" in the GitLab docs):
// {description, check_name, fingerprint, severity, location: {path, lines: {begin}}}, severity one of
// info | minor | major | critical | blocker, no BOM; issues with equal fingerprints are collapsed.
const SEVERITIES = ["info", "minor", "major", "critical", "blocker"];

interface Issue {
  description: string;
  check_name: string;
  fingerprint: string;
  severity: string;
  location: { path: string; lines: { begin: number } };
}

describe("codequality", () => {
  const text = codequality([sales, returns], ctx);
  const issues = JSON.parse(text) as Issue[];

  test("matches GitLab's documented issue shape", () => {
    expect(text.charCodeAt(0)).not.toBe(0xfeff);
    expect(Array.isArray(issues)).toBe(true);
    expect(issues).toHaveLength(sales.findings.length);
    for (const i of issues) {
      expect(Object.keys(i).sort()).toEqual(["check_name", "description", "fingerprint", "location", "severity"]);
      expect(SEVERITIES).toContain(i.severity);
      expect(typeof i.description).toBe("string");
      expect(Object.keys(i.location).sort()).toEqual(["lines", "path"]);
      expect(Number.isInteger(i.location.lines.begin) && i.location.lines.begin >= 1).toBe(true);
    }
  });

  test("levels map to severities, lines to the delivery, whole-file findings to line 1", () => {
    const discount = issues.filter((i) => i.check_name === "discount.max");
    expect(discount.map((i) => [i.severity, i.location.path, i.location.lines.begin])).toEqual([
      ["critical", "deliveries/dealer-sales/w48.csv", 18],
      ["critical", "deliveries/dealer-sales/w48.csv", 231],
      ["critical", "deliveries/dealer-sales/w48.csv", 4104],
    ]);
    expect(issues.find((i) => i.check_name === "outlier:unit_price")?.severity).toBe("major");
    expect(issues.find((i) => i.check_name === "header.unexpected")?.severity).toBe("info");
    expect(issues.find((i) => i.check_name === "group:invoice-total")?.location.lines.begin).toBe(1);
  });

  test("fingerprints are unique, so GitLab collapses nothing, even across deliveries", () => {
    const many = JSON.parse(codequality([bulk(500, 20), sales, { ...sales, input: { ...sales.input, path: "deliveries/dealer-sales/w49.csv" } }], ctx)) as Issue[];
    expect(new Set(many.map((i) => i.fingerprint)).size).toBe(many.length);
    // the two identical outlier findings of the fixture (same value) still differ
    const outliers = issues.filter((i) => i.check_name === "outlier:unit_price").map((i) => i.fingerprint);
    expect(outliers[0]).not.toBe(outliers[1]);
  });

  test("no findings is an empty array; golden", () => {
    expect(JSON.parse(codequality([returns], ctx))).toEqual([]);
    expectGolden("codequality.json", text);
  });
});
