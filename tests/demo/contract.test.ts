import { describe, expect, it } from "vitest";
import { loadContract } from "../../src/contract/load.js";
import { loadRegistry } from "../../src/registry/index.js";

describe("demo contract", () => {
  it("compiles against the repository registry", async () => {
    const registry = await loadRegistry(process.cwd());
    expect(registry.ok ? [] : registry.problems).toEqual([]);
    if (!registry.ok) return;
    const plan = await loadContract("contracts/dealer-sales.contract.yaml", { registry: registry.value });
    expect(plan.ok ? [] : plan.problems).toEqual([]);
  });
});
