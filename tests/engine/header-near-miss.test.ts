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

describe("a header far from its contract", () => {
  // 120 declared columns, none in a header of 120 other names: 14,400 pairs, past the 10,000 that get
  // suggestions. Every name is still reported; none is guessed at.
  const declared = Array.from({ length: 120 }, (_, i) => `amount_${i}`);
  const big = `tablegate: 1\nname: far\ninput: { header: any-order }\ncolumns:\n${declared.map((c) => `  ${c}: { type: integer }\n`).join("")}`;
  const header = declared.map((c) => `${c}x`).join(",");

  it("reports every missing and undeclared name, without suggestions", async () => {
    const { report } = await checkJson(big, `${header}\n`, ["--max-findings", "1000"]);
    const missing = report.checks.find((c) => c.rule === "header.missing")?.failed;
    const unexpected = report.checks.find((c) => c.rule === "header.unexpected")?.failed;
    expect({ missing, unexpected }).toEqual({ missing: 120, unexpected: 120 });
    expect(report.findings.filter((f) => f.message.includes("did you mean"))).toEqual([]);
  });

  it("the same near misses a few at a time are suggested", async () => {
    const few = `tablegate: 1\nname: far\ninput: { header: any-order }\ncolumns:\n${declared.slice(0, 3).map((c) => `  ${c}: { type: integer }\n`).join("")}`;
    const { report } = await checkJson(few, `${declared.slice(0, 3).map((c) => `${c}x`).join(",")}\n`);
    expect(report.findings.filter((f) => f.message.includes("did you mean"))).toHaveLength(6);
  });
});
