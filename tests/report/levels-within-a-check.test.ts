/**
 * A check can report some findings at another level than its own: a postal code that no known layout
 * can judge is a note under a `postal` check of level error. Every format must show each finding under
 * its own level, with counts that match the JSON (which carries each finding's level and counts them
 * in `counts`).
 */
import { describe, expect, it } from "vitest";
import { runCli } from "../helpers/cli.js";

const contract = "tablegate: 1\nname: addresses\ncolumns:\n  country: { type: text }\n  postcode: { type: text, postal: country }\n";
// US 1234 is no ZIP code (USPS: five digits, from memory); HK has no postal layout, so 999 is a note.
const both = "country,postcode\nUS,12345\nUS,1234\nHK,999\n";
const noteOnly = "country,postcode\nUS,12345\nHK,999\n";
const reports = ["--report", "text=out.txt", "--report", "json=out.json", "--report", "junit=out.xml", "--report", "html=out.html", "--report", "sarif=out.sarif"];
const readBack = ["out.txt", "out.json", "out.xml", "out.html", "out.sarif"];

async function runWith(data: string, extra: readonly string[] = []) {
  const r = await runCli(["check", "d.csv", "--contract", "c.yaml", ...reports, ...extra], { "c.yaml": contract, "d.csv": data }, { readBack });
  const json = JSON.parse(r.files["out.json"] ?? "{}") as { counts: Record<string, number>; findings: { rule: string; level: string; row: number }[] };
  return { ...r, json, text: r.files["out.txt"] ?? "", junit: r.files["out.xml"] ?? "", html: r.files["out.html"] ?? "", sarif: r.files["out.sarif"] ?? "" };
}

describe("findings at another level than their check's", () => {
  it("the JSON has one error and one note", async () => {
    const r = await runWith(both);
    expect(r.json.findings.map((f) => [f.rule, f.level, f.row])).toEqual([["postcode.postal", "error", 2], ["postcode.postal", "note", 3]]);
    expect([r.json.counts.error, r.json.counts.note]).toEqual([1, 1]);
  });

  it("text shows each under its own level heading, one finding each", async () => {
    const { text } = await runWith(both);
    const error = text.slice(text.indexOf("ERROR   postcode.postal"), text.indexOf("NOTE    postcode.postal"));
    const note = text.slice(text.indexOf("NOTE    postcode.postal"));
    expect([error.includes("1 finding"), error.includes("row 2"), error.includes("row 3")]).toEqual([true, true, false]);
    expect([note.includes("1 finding"), note.includes("row 3"), note.includes("row 2")]).toEqual([true, true, false]);
  });

  it("text, JUnit and HTML still show a note when it is the check's only finding", async () => {
    const r = await runWith(noteOnly);
    expect(r.code).toBe(0);
    expect(r.text).toMatch(/NOTE {4}postcode\.postal · 1 finding[\s\S]*row 2/);
    expect(r.junit).toContain('name="postcode.postal (note)"');
    expect(r.junit).not.toContain("<failure");
    expect(r.html).toContain("999");
  });

  it("JUnit fails only on the error, listing only the error's row", async () => {
    const { junit } = await runWith(both);
    const failure = junit.slice(junit.indexOf("<failure"), junit.indexOf("</failure>"));
    expect([failure.includes("1 finding"), /row 2\b/.test(failure), /row 3\b/.test(failure)]).toEqual([true, true, false]);
  });

  it("SARIF's truncation notice counts every finding, notes included", async () => {
    const { sarif } = await runWith(both, ["--max-findings", "1"]);
    const log = JSON.parse(sarif) as { runs: { properties: { findingsTotal: number }; invocations: { toolExecutionNotifications?: { message: { text: string } }[] }[] }[] };
    const run = log.runs[0];
    expect(run?.properties.findingsTotal).toBe(2);
    expect(run?.invocations[0]?.toolExecutionNotifications?.some((n) => n.message.text.includes("after 1 of 2"))).toBe(true);
  });
});
