/**
 * SPEC §4: "`source` points at the contract line that declared the check". The header policy declares
 * whether extra or reordered columns count, so those checks point at `input.header` when it is written.
 */
import { describe, expect, it } from "vitest";
import { checkJson } from "../helpers/cli.js";

describe("check sources", () => {
  it("header.unexpected and header.order point at input.header; header.missing at the columns", async () => {
    const contract = "tablegate: 1\nname: x\ninput:\n  header: ordered\ncolumns:\n  a: { type: text }\n";
    const { report } = await checkJson(contract, "b,a\n1,2\n");
    const at = (rule: string) => report.checks.find((c) => c.rule === rule)?.source?.line;
    expect({ unexpected: at("header.unexpected"), order: at("header.order"), missing: at("header.missing") }).toEqual({ unexpected: 4, order: 4, missing: 6 });
  });

  it("without input.header they point at the columns", async () => {
    const { report } = await checkJson("tablegate: 1\nname: x\ncolumns:\n  a: { type: text }\n", "a\n1\n");
    expect(report.checks.find((c) => c.rule === "header.unexpected")?.source?.line).toBe(4);
  });
});
