import { describe, expect, it } from "vitest";
import { checkFile, loadContract, loadRegistry, WRITERS } from "../../src/index.js";

describe("the library entry point", () => {
  it("compiles the demo contract, checks the demo delivery and writes JSON, as the CLI does", async () => {
    const registry = await loadRegistry(process.cwd());
    expect(registry.ok).toBe(true);
    if (!registry.ok) return;
    const plan = await loadContract("contracts/dealer-sales.contract.yaml", { registry: registry.value });
    expect(plan.ok).toBe(true);
    if (!plan.ok) return;
    const report = await checkFile(plan.value, "contracts/samples/dealer-sales-w47.csv", { reportPath: "w47.csv", contractPath: "dealer-sales.contract.yaml" });
    expect(report.ok).toBe(true);
    if (!report.ok) return;
    expect([report.value.verdict, report.value.input.rows]).toEqual(["pass", 27]);
    const json = JSON.parse(WRITERS.json([report.value], { root: process.cwd(), toolVersion: "0.1.0" })) as { verdict: string };
    expect(json.verdict).toBe("pass");
  });
});
