/**
 * Keys on typed columns. SPEC §1.1 says cells are trimmed before every check but not whether a key
 * compares text or parsed values. A SQL UNIQUE constraint on an INTEGER column (ISO/IEC 9075) compares
 * values, so 01 and 1 collide; so do they here.
 */
import { describe, expect, it } from "vitest";
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

describe("a key part that is blank or fails its type is NULL", () => {
  // SPEC §1.1: a cell that fails to parse "is one finding (<column>.type) and its other checks are
  // skipped"; as a NULL it leaves the key incomplete, and a SQL UNIQUE constraint (ISO/IEC 9075)
  // never compares a key with a NULL part.
  const contract = "tablegate: 1\nname: k\ncolumns:\n  invoice: { type: text }\n  line: { type: integer }\nkeys: [[invoice, line]]\n";

  it("two rows with the same unreadable part give two type findings and no key finding (whole-row repeats still count)", async () => {
    const { report } = await checkJson(contract, "invoice,line\nINV-1,1\nINV-1,one\nINV-1,one\nINV-1,\nINV-1,\n");
    const rules = report.findings.map((f) => `${f.rule}@${f.row}`);
    expect(rules).toEqual(["line.type@2", "line.type@3", "duplicates@3", "duplicates@5"]);
  });

  it("the same key with every part readable still repeats", async () => {
    const { report } = await checkJson(contract, "invoice,line\nINV-1,one\nINV-1,2\nINV-1,02\n");
    expectFinding(report, { rule: "key:invoice+line", row: 3, line: 4, level: "error" });
  });
});
