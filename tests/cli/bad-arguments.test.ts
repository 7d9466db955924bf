/**
 * SPEC §3: a run that cannot be judged because of its arguments says so in one line on stderr (exit 2),
 * naming what was wrong and pointing at `--help`; `--help` prints the usage on stdout (exit 0).
 * Wording is not asserted; what a line names is.
 */
import { describe, expect, it } from "vitest";
import { runCli, type CliRun } from "../helpers/cli.js";

const contract = "tablegate: 1\nname: items\ncolumns:\n  id: { type: integer, min: 1 }\n";
const files = { "c.yaml": contract, "d.csv": "id\n1\n" };

const lines = (r: CliRun) => r.stderr.split("\n").filter((l) => l.trim() !== "");

/** Exit 2, nothing on stdout, exactly one stderr line that names `words` and the help command. */
function oneLine(r: CliRun, help: string, ...words: string[]): void {
  expect({ code: r.code, lines: lines(r).length, stdout: r.stdout }).toEqual({ code: 2, lines: 1, stdout: "" });
  for (const w of [...words, help]) expect(lines(r)[0]).toContain(w);
  expect(r.stderr).not.toContain("usage:");
}

describe("bad arguments: one line, with where the usage is", () => {
  it("an unknown command", async () => {
    oneLine(await runCli(["bogus"]), "tablegate --help", '"bogus"', "check", "lint");
  });

  it("no command at all", async () => {
    oneLine(await runCli([]), "tablegate --help", "check");
  });

  it("an unknown option to check", async () => {
    oneLine(await runCli(["check", "d.csv", "-c", "c.yaml", "--frobnicate"], files), "tablegate check --help", "--frobnicate");
  });

  it("an option of check given no value", async () => {
    oneLine(await runCli(["check", "d.csv", "--contract"], files), "tablegate check --help", "--contract");
  });

  it("check with nothing to check", async () => {
    oneLine(await runCli(["check"], files), "tablegate check --help", "tablegate.yaml");
  });

  it("lint without a contract", async () => {
    oneLine(await runCli(["lint"]), "tablegate lint --help", "contract");
  });

  it("lint reads an unknown option as an option, not as a contract file name", async () => {
    const r = await runCli(["lint", "--strict", "c.yaml"], files);
    oneLine(r, "tablegate lint --help", "--strict");
    expect(r.stderr).not.toContain("cannot read");
  });

  it("lint still reads a contract file after --", async () => {
    const r = await runCli(["lint", "--", "c.yaml"], files);
    expect({ code: r.code, stderr: r.stderr }).toEqual({ code: 0, stderr: "" });
    expect(r.stdout).toContain("c.yaml");
  });

  it("schema with an extra argument", async () => {
    oneLine(await runCli(["schema", "contract", "extra-arg"]), "tablegate schema --help", "extra-arg");
  });

  it("schema with an unknown kind", async () => {
    oneLine(await runCli(["schema", "delivery"]), "tablegate schema --help", "delivery");
  });

  it("fix with a missing option", async () => {
    oneLine(await runCli(["fix", "d.csv", "-c", "c.yaml", "--out", "o.csv", "--rejects", "r.csv"], files), "tablegate fix --help", "--log");
  });

  it("infer with two files", async () => {
    oneLine(await runCli(["infer", "a.csv", "b.csv"]), "tablegate infer --help", "2");
  });

  it("ref with an unknown subcommand, and ref without one", async () => {
    oneLine(await runCli(["ref", "bogus"]), "tablegate ref --help", '"bogus"', "list");
    oneLine(await runCli(["ref"]), "tablegate ref --help", "list");
  });

  it("ref list with a stray word", async () => {
    oneLine(await runCli(["ref", "list", "extra"]), "tablegate ref --help", '"extra"');
  });

  it("ref show without a table", async () => {
    oneLine(await runCli(["ref", "show"]), "tablegate ref --help", "table");
  });
});

describe("--help", () => {
  for (const argv of [["check"], ["lint"], ["fix"], ["infer"], ["schema"], ["ref"], ["ref", "diff"]]) {
    it(`${argv.join(" ")} --help prints its usage on stdout`, async () => {
      const r = await runCli([...argv, "--help"]);
      expect({ code: r.code, stderr: r.stderr }).toEqual({ code: 0, stderr: "" });
      expect(r.stdout).toMatch(/^usage: /);
      expect(r.stdout).toContain(`tablegate ${argv.join(" ")}`);
    });
  }

  it("tablegate --help lists every command", async () => {
    const r = await runCli(["--help"]);
    expect({ code: r.code, stderr: r.stderr }).toEqual({ code: 0, stderr: "" });
    for (const c of ["check", "lint", "ref", "fix", "schema", "infer"]) expect(r.stdout).toContain(`tablegate ${c}`);
  });
});
