/**
 * A reader that stops early (`tablegate check ... | head -1`) closes the pipe under the process. The
 * run still exits with its verdict (README "Exit status") and prints no stack trace. Runs the built
 * bin/tablegate.js as a shell pipeline would: a real child process whose stdout is closed the
 * moment it starts, before the report is written.
 */
import { spawn } from "node:child_process";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";

const ROOT = fileURLToPath(new URL("../../", import.meta.url));

function closedAtOnce(args: readonly string[]): Promise<{ code: number | null; stderr: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, ["bin/tablegate.js", ...args], { cwd: ROOT, env: { ...process.env, NO_COLOR: "1", GITHUB_ACTIONS: "" } });
    let stderr = "";
    child.stderr.on("data", (d: Buffer) => (stderr += d.toString()));
    child.stdout.destroy();
    child.on("close", (code) => resolve({ code, stderr }));
  });
}

describe("output closed early", () => {
  const contract = ["--contract", "contracts/dealer-sales.contract.yaml"];
  it.each([
    ["a passing delivery, SARIF", "contracts/samples/dealer-sales-w47.csv", ["--report", "sarif=-"], 0],
    ["a failing delivery, text", "contracts/samples/dealer-sales-w48.csv", [], 1],
  ] as const)("%s: the verdict's exit status, no stack trace", async (_name, file, report, code) => {
    const r = await closedAtOnce(["check", file, ...contract, ...report]);
    expect(r.stderr).not.toMatch(/EPIPE|\n\s+at /);
    expect(r.code).toBe(code);
  });
});
