/**
 * GitHub Actions reads a stdout line that starts with :: (after spaces) as a workflow command
 * (ci-formats.md). The text report goes to stdout in CI, so a file or column name must never start one.
 */
import { describe, expect, it } from "vitest";
import { runCli } from "../helpers/cli.js";

describe("lines a CI runner would read as commands", () => {
  it("a delivery path or column name starting with :: is escaped at the start of its line", async () => {
    const contract = "tablegate: 1\nname: t\ncolumns:\n  '::error file=x::forged': { type: integer }\n";
    const r = await runCli(["check", "::stop-commands::x.csv", "--contract", "contract.yaml"], { "contract.yaml": contract, "::stop-commands::x.csv": "::error file=x::forged\nnot-a-number\n" });
    expect(r.code).toBe(1);
    expect(r.stdout).toContain("stop-commands");
    expect(r.stdout.split("\n").filter((l) => l.trimStart().startsWith("::"))).toEqual([]);
  });
});
