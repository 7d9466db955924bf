/**
 * SPEC §1.4: a near miss ("Ship Date" vs ship_date) is suggested in the finding's message. Wording is
 * free; the suggestion must name the other spelling.
 */
import { describe, expect, it } from "vitest";
import { checkJson } from "../helpers/cli.js";

const contract = "tablegate: 1\nname: near\ninput: { header: exact }\ncolumns:\n  sku: { type: text }\n  ship_date: { type: date }\n";

describe("header near miss", () => {
  it("the finding about the misspelt column names the declared one", async () => {
    const { report } = await checkJson(contract, "sku,Ship Date\nA,2024-01-01\n");
    const header = report.findings.filter((f) => f.rule.startsWith("header."));
    expect(header.map((f) => f.rule).sort()).toEqual(["header.missing", "header.unexpected"]);
    expect(header.some((f) => f.message.includes("ship_date") && f.message.includes("Ship Date"))).toBe(true);
  });

  it("a far-off name is reported as itself", async () => {
    const { report } = await checkJson(contract, "sku,colour\nA,red\n");
    const unexpected = report.findings.find((f) => f.rule === "header.unexpected");
    expect(unexpected?.column).toBe("colour");
  });
});
