import { describe, expect, it } from "vitest";
import { checkJson } from "../helpers/cli.js";

// With a key declared, whole-row duplicates are only looked for among rows whose key repeats (an
// exact copy repeats its key too). These cases pin that the shortcut finds every duplicate and names
// the first identical row, as SPEC 1.1 asks.
const contract = "tablegate: 1\nname: dups\ncolumns:\n  id: { type: integer }\n  v: { type: text }\nkeys: [id]\n";

const dupRows = (report: { findings: readonly { rule: string; row?: number; message: string }[] }) =>
  report.findings.filter((f) => f.rule === "duplicates").map((f) => [f.row, Number(/row (\d+) exactly/.exec(f.message)?.[1])]);

describe("whole-row duplicates beside a key", () => {
  it("a copy of the second row with a key seen three times names the second row", async () => {
    const { report } = await checkJson(contract, "id,v\n1,a\n1,b\n1,b\n1,a\n");
    expect(dupRows(report)).toEqual([
      [3, 2],
      [4, 1],
    ]);
    expect(report.checks.find((c) => c.rule === "key:id")?.failed).toBe(3);
  });

  it("copies of a row whose key is blank are still duplicates", async () => {
    const { report } = await checkJson(contract, "id,v\n,a\n,a\n2,x\n,a\n");
    expect(dupRows(report)).toEqual([
      [2, 1],
      [4, 1],
    ]);
  });

  it("typed keys that repeat without identical cells are not duplicates", async () => {
    const { report } = await checkJson(contract, "id,v\n1,a\n01,a\n");
    expect(dupRows(report)).toEqual([]);
    expect(report.checks.find((c) => c.rule === "key:id")?.failed).toBe(1);
  });

  it("a ragged row in between keeps later rows' numbers right", async () => {
    const { report } = await checkJson(contract, "id,v\n5,a\n6\n5,a\n");
    expect(dupRows(report)).toEqual([[3, 1]]);
  });
});
