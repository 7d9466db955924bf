/**
 * SPEC §3 exit statuses: 0 the delivery meets the contract, 1 it does not, 2 the run could not be
 * judged, with one clear message on stderr. Wording is not asserted; what a message names is.
 */
import { describe, expect, it } from "vitest";
import { runCli, type CliRun } from "../helpers/cli.js";

const contract = "tablegate: 1\nname: items\ncolumns:\n  id: { type: integer, min: 1 }\n  item: { type: text, required: true }\n";
const clean = "id,item\n1,tent\n2,stove\n";
const failing = "id,item\n1,tent\n0,stove\n";

const lines = (r: CliRun) => r.stderr.split("\n").filter((l) => l.trim() !== "");
const noStack = (r: CliRun) => expect(r.stderr).not.toMatch(/\n\s+at /);

describe("exit statuses", () => {
  it("0 for a clean delivery, nothing on stderr when stderr is not a terminal", async () => {
    const r = await runCli(["check", "d.csv", "--contract", "c.yaml"], { "c.yaml": contract, "d.csv": clean });
    expect({ code: r.code, stderr: r.stderr }).toEqual({ code: 0, stderr: "" });
    expect(r.stdout.length).toBeGreaterThan(0);
  });

  it("1 for a failing delivery", async () => {
    const r = await runCli(["check", "d.csv", "--contract", "c.yaml"], { "c.yaml": contract, "d.csv": failing });
    expect(r.code).toBe(1);
    noStack(r);
  });

  it("1 when any of several deliveries fails, 0 when all pass", async () => {
    const files = { "c.yaml": contract, "a.csv": clean, "b.csv": failing, "c.csv": clean };
    expect((await runCli(["check", "a.csv", "b.csv", "--contract", "c.yaml"], files)).code).toBe(1);
    expect((await runCli(["check", "a.csv", "c.csv", "--contract", "c.yaml"], files)).code).toBe(0);
  });

  it("2 for an unknown command, naming it", async () => {
    const r = await runCli(["chek", "d.csv"]);
    expect({ code: r.code, lines: lines(r).length }).toEqual({ code: 2, lines: 1 });
    expect(lines(r)[0]).toContain("chek");
  });

  it("2 with no command at all: one line", async () => {
    const r = await runCli([]);
    expect({ code: r.code, lines: lines(r).length }).toEqual({ code: 2, lines: 1 });
  });

  it("2 for an unknown flag, naming it", async () => {
    const r = await runCli(["check", "d.csv", "--contract", "c.yaml", "--bogus"], { "c.yaml": contract, "d.csv": clean });
    expect({ code: r.code, lines: lines(r).length }).toEqual({ code: 2, lines: 1 });
    expect(lines(r)[0]).toContain("--bogus");
    expect(r.stdout).toBe("");
    noStack(r);
  });

  it("2 for a --parse-thread value other than auto, on or off, naming the option", async () => {
    const r = await runCli(["check", "d.csv", "--contract", "c.yaml", "--parse-thread", "2"], { "c.yaml": contract, "d.csv": clean });
    expect({ code: r.code, lines: lines(r).length, stdout: r.stdout }).toEqual({ code: 2, lines: 1, stdout: "" });
    expect(r.stderr).toContain("--parse-thread");
  });

  it("the same verdict with --parse-thread on, off or auto", async () => {
    for (const mode of ["on", "off", "auto"]) {
      const files = { "c.yaml": contract, "a.csv": clean, "b.csv": failing };
      expect((await runCli(["check", "a.csv", "--contract", "c.yaml", "--parse-thread", mode], files)).code).toBe(0);
      expect((await runCli(["check", "b.csv", "--contract", "c.yaml", "--parse-thread", mode], files)).code).toBe(1);
    }
  });

  it("2 for a missing delivery file: one line naming the file", async () => {
    const r = await runCli(["check", "missing.csv", "--contract", "c.yaml"], { "c.yaml": contract });
    expect({ code: r.code, lines: lines(r).length, stdout: r.stdout }).toEqual({ code: 2, lines: 1, stdout: "" });
    expect(r.stderr).toContain("missing.csv");
  });

  it("2 for a delivery path that is a folder", async () => {
    const r = await runCli(["check", "sub", "--contract", "c.yaml"], { "c.yaml": contract, "sub/x.txt": "" });
    expect({ code: r.code, lines: lines(r).length }).toEqual({ code: 2, lines: 1 });
    expect(r.stderr).toContain("sub");
    noStack(r);
  });

  it("2 for a missing contract file: one line naming it", async () => {
    const r = await runCli(["check", "d.csv", "--contract", "nope.yaml"], { "d.csv": clean });
    expect({ code: r.code, lines: lines(r).length, stdout: r.stdout }).toEqual({ code: 2, lines: 1, stdout: "" });
    expect(r.stderr).toContain("nope.yaml");
  });

  // `--max-findings=-1` keeps node:util parseArgs from reading -1 as a flag of its own.
  for (const bad of ["abc", "-1", "1.5", ""]) {
    it(`2 for --max-findings ${JSON.stringify(bad)}: one line naming the option`, async () => {
      const r = await runCli(["check", "d.csv", "--contract", "c.yaml", `--max-findings=${bad}`], { "c.yaml": contract, "d.csv": clean });
      expect({ code: r.code, lines: lines(r).length, stdout: r.stdout }).toEqual({ code: 2, lines: 1, stdout: "" });
      expect(r.stderr).toContain("--max-findings");
    });
  }

  it("2 for --max-findings -1 given as two arguments", async () => {
    const r = await runCli(["check", "d.csv", "--contract", "c.yaml", "--max-findings", "-1"], { "c.yaml": contract, "d.csv": clean });
    expect({ code: r.code, stdout: r.stdout }).toEqual({ code: 2, stdout: "" });
    expect(lines(r)[0]).toContain("--max-findings");
  });

  it("2 for --fail-on with an unknown level", async () => {
    const r = await runCli(["check", "d.csv", "--contract", "c.yaml", "--fail-on", "note"], { "c.yaml": contract, "d.csv": clean });
    expect({ code: r.code, lines: lines(r).length }).toEqual({ code: 2, lines: 1 });
    expect(r.stderr).toContain("--fail-on");
  });

  it("2 for an unknown report format, naming it", async () => {
    const r = await runCli(["check", "d.csv", "--contract", "c.yaml", "--report", "pdf=out.pdf"], { "c.yaml": contract, "d.csv": clean });
    expect({ code: r.code, lines: lines(r).length }).toEqual({ code: 2, lines: 1 });
    expect(r.stderr).toContain("pdf");
  });

  it("2 for check without a delivery file", async () => {
    const r = await runCli(["check", "--contract", "c.yaml"], { "c.yaml": contract });
    expect({ code: r.code, lines: lines(r).length }).toEqual({ code: 2, lines: 1 });
    noStack(r);
  });

  it("--max-findings 0 keeps no findings but the exact tallies and the verdict", async () => {
    const r = await runCli(["check", "d.csv", "--contract", "c.yaml", "--report", "json=-", "--max-findings", "0"], { "c.yaml": contract, "d.csv": failing });
    const rep = JSON.parse(r.stdout) as { verdict: string; findings: unknown[]; truncated: boolean; checks: { rule: string; failed: number }[] };
    expect({ code: r.code, verdict: rep.verdict, findings: rep.findings.length, truncated: rep.truncated }).toEqual({ code: 1, verdict: "fail", findings: 0, truncated: true });
    expect(rep.checks.find((c) => c.rule === "id.min")?.failed).toBe(1);
  });
});

describe("report destinations", () => {
  it("json to a file leaves the text report on stdout", async () => {
    const r = await runCli(["check", "d.csv", "--contract", "c.yaml", "--report", "json=out/report.json"], { "c.yaml": contract, "d.csv": failing, "out/.keep": "" }, { readBack: ["out/report.json"] });
    expect(r.code).toBe(1);
    const rep = JSON.parse(r.files["out/report.json"] ?? "null") as { verdict: string } | null;
    expect(rep?.verdict).toBe("fail");
    expect(r.stdout.length).toBeGreaterThan(0);
    expect(() => JSON.parse(r.stdout)).toThrow();
  });

  it("NO_COLOR: no ANSI escapes in the text report", async () => {
    const r = await runCli(["check", "d.csv", "--contract", "c.yaml"], { "c.yaml": contract, "d.csv": failing }, { env: { NO_COLOR: "1" }, stderrIsTty: true });
    expect(r.stdout + r.stderr).not.toMatch(/\u001b\[/);
  });
});

describe("schema", () => {
  it("prints the path of an existing contract schema (draft 2020-12)", async () => {
    const { existsSync, readFileSync } = await import("node:fs");
    const r = await runCli(["schema"]);
    const path = r.stdout.trim();
    expect({ code: r.code, exists: existsSync(path) }).toEqual({ code: 0, exists: true });
    expect((JSON.parse(readFileSync(path, "utf8")) as { $schema: string }).$schema).toBe("https://json-schema.org/draft/2020-12/schema");
  });

  it("prints the path of an existing report schema", async () => {
    const { existsSync } = await import("node:fs");
    const r = await runCli(["schema", "report"]);
    expect({ code: r.code, exists: existsSync(r.stdout.trim()) }).toEqual({ code: 0, exists: true });
  });
});
