/**
 * Keys on typed columns. SPEC §1.1 says cells are trimmed before every check but not whether a key
 * compares text or parsed values. A SQL UNIQUE constraint on an INTEGER column (ISO/IEC 9075) compares
 * values, so 01 and 1 collide; so do they here.
 */
import { describe, it } from "vitest";
import { checkJson } from "../helpers/cli.js";
import { expectFinding } from "../helpers/findings.js";

describe("keys compare typed values", () => {
  it("integer keys: 01 repeats 1", async () => {
    const contract = "tablegate: 1\nname: k\ncolumns:\n  id: { type: integer }\n  v: { type: text }\nkeys: [id]\n";
    const { report } = await checkJson(contract, "id,v\n1,a\n01,b\n");
    expectFinding(report, { rule: "key:id", row: 2, line: 3, level: "error" });
  });

  it("date keys: 2024-01-05 and 05/01/2024 under two formats are the same day", async () => {
    const contract = 'tablegate: 1\nname: k\ncolumns:\n  day: { type: date, format: ["%Y-%m-%d", "%d/%m/%Y"] }\n  v: { type: text }\nkeys: [day]\n';
    const { report } = await checkJson(contract, "day,v\n2024-01-05,a\n05/01/2024,b\n");
    expectFinding(report, { rule: "key:day", row: 2, line: 3, level: "error" });
  });
});
