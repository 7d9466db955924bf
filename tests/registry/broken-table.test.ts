/**
 * A project table that does not load blocks only what uses it (README, Lock): a contract that never
 * names it is still checked; one that names it is refused at its own line, naming the table's problem.
 */
import { writeFile } from "node:fs/promises";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { tablegate, tempRepo } from "./helpers.js";

// Invented data: an outdoor-gear wholesaler's code lists.
const GOOD = "code,name\nTENT,Tents\nPACK,Packs\n";
const FILES: Record<string, string> = {
  "reference/registry.yaml": 'tables:\n  gear-categories:\n    file: gear-categories.csv\n    key: code\n    version: "1"\n  kinds:\n    file: kinds.csv\n    key: kind\n    version: "1"\n',
  "reference/gear-categories.csv": GOOD,
  "reference/kinds.csv": "kind,unit\nTMP,c\nHUM,p\n",
  "uses-categories.yaml": "tablegate: 1\nname: a\ncolumns:\n  category: { type: text, codes: { table: gear-categories, column: code } }\n",
  "uses-kinds.yaml": "tablegate: 1\nname: b\ncolumns:\n  kind:\n    type: text\n    codes: { table: kinds, column: kind }\n",
  "categories.csv": "category\nTENT\n",
  "kinds.csv": "kind\nTMP\n",
};


describe("a table that does not load", () => {
  it("blocks the contracts and commands that use it, and nothing else", async () => {
    const root = await tempRepo(FILES);
    expect((await tablegate(root, "ref", "lock")).code).toBe(0);
    // Line 3 repeats the key of line 2.
    await writeFile(join(root, "reference/kinds.csv"), "kind,unit\nTMP,c\nTMP,d\n");

    const other = await tablegate(root, "check", "categories.csv", "--contract", "uses-categories.yaml");
    expect(other.code).toBe(0);
    const user = await tablegate(root, "check", "kinds.csv", "--contract", "uses-kinds.yaml");
    const lines = user.err.trim().split("\n");
    expect({ code: user.code, lines: lines.length }).toEqual({ code: 2, lines: 1 });
    expect(lines[0]).toMatch(/^tablegate: uses-kinds\.yaml:6:\d+: .*kinds.*reference\/kinds\.csv:3/);

    const list = await tablegate(root, "ref", "list");
    expect({ code: list.code, listsGood: list.out.includes("gear-categories"), listsBroken: list.out.includes("kinds") }).toEqual({ code: 0, listsGood: true, listsBroken: false });
    expect(list.err).toContain('"kinds"');
    expect((await tablegate(root, "ref", "show", "gear-categories")).code).toBe(0);
    expect((await tablegate(root, "ref", "show", "kinds")).code).toBe(2);
    expect((await tablegate(root, "ref", "lint")).code).toBe(1);
    expect((await tablegate(root, "ref", "lock")).code).toBe(2);
  });

  it("lint refuses, as check does, a contract whose table left its lock", async () => {
    const root = await tempRepo(FILES);
    expect((await tablegate(root, "ref", "lock")).code).toBe(0);
    expect((await tablegate(root, "lint", "uses-kinds.yaml")).code).toBe(0);
    await writeFile(join(root, "reference/kinds.csv"), "kind,unit\nTMP,c\nHUM,p\nPRS,h\n");
    expect((await tablegate(root, "lint", "uses-kinds.yaml")).code).toBe(2);
    expect((await tablegate(root, "check", "kinds.csv", "--contract", "uses-kinds.yaml")).code).toBe(2);
    expect((await tablegate(root, "lint", "uses-categories.yaml")).code).toBe(0);
  });
});
