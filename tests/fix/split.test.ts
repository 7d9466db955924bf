import { readdir, symlink } from "node:fs/promises";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { mask } from "../../src/report/mask.js";
import { FIX_ARGS, fixRun, logEntries, project, records, removedAfterEach } from "./helpers.js";

const open = removedAfterEach();

// An invented delivery of an outdoor-gear wholesaler: order lines with messy but readable cells.
const CONTRACT = `tablegate: 1
name: dealer-orders
input:
  blank: ["NA", "N/A"]
keys: [[order_no, line_no]]
columns:
  order_no: { type: text, required: true, pattern: '^ORD-[0-9]{4}$' }
  line_no: { type: integer, required: true, min: 1 }
  ship_date: { type: date, format: ["%Y-%m-%d", "%m/%d/%Y", serial-1900] }
  qty: { type: integer, min: 1, thousands: "," }
  unit_price: { type: decimal, min: 0, thousands: ",", scale: 2 }
  discount: { type: decimal, percent: true, max: 0.6 }
  gift_wrap: { type: boolean }
  contact: { type: text, format: email, sensitive: true }
rules:
  - id: big-orders-ship
    when: qty > 1000
    assert: ship_date IS NOT NULL
`;

const LINES = [
  "order_no,line_no,ship_date,qty,unit_price,discount,gift_wrap,contact",
  'ORD-0001,1,11/24/2026,"1,200","1,234.50",15%,yes,  kim.tan@example.org ',
  "ORD-0001,2, 2026-11-25 ,3,NA,,N,lee@example.org",
  'ORD-0002,1,46000,0,5.00,5%,1,"Ridge, ""North"" store"',
  "ORD-0002,2,N/A,\"2,000\",12.00,,no,ana@example.org",
  "ORD-0001,1,2026-11-26,2,1.00,,no,",
  "ORD-0003,1,2026-11-27,5,19.99,60%,Y,sam@example.org",
];
const DATA = `${LINES.join("\r\n")}\r\n`;

describe("fix splits a delivery", () => {
  test("a record that still fails after repair goes to rejects with its cells exactly as given", async () => {
    const r = await fixRun(CONTRACT, DATA);
    open.push(r.p);
    expect(r.ran.code).toBe(1);
    const rejects = (r.rejects ?? "").split("\r\n");
    expect(rejects[0]).toBe(`_row,_line,_rules,${LINES[0]}`);
    // Row 3 (qty 0 and a contact that is no e-mail), row 4 (big order without ship date), row 5 (key of row 1 again).
    expect(rejects.slice(1, -1)).toEqual([
      `3,4,qty.min;contact.format,${LINES[3]}`,
      `4,5,rule:big-orders-ship,${LINES[4]}`,
      `5,6,key:order_no+line_no,${LINES[5]}`,
    ]);
    // The same seen through an independent CSV reader (csv-parse): cells byte for byte.
    const given = records(DATA);
    const back = records(r.rejects ?? "");
    for (const [i, row] of [[1, 3], [2, 4], [3, 5]] as const) expect(back[i]?.slice(3)).toEqual(given[row]);
    // Every data record of the delivery is in exactly one of the two files.
    expect(records(r.out ?? "").length - 1 + back.length - 1).toBe(given.length - 1);
  });

  test("the log has one entry per changed cell and none for cells left as they were", async () => {
    const r = await fixRun(CONTRACT, DATA);
    open.push(r.p);
    const given = records(DATA);
    const clean = records(r.out ?? "");
    const header = given[0] as string[];
    const log = logEntries(r.log ?? "");
    const changes = log.filter((e) => e.rejected !== true);
    // The clean records are rows 1, 2 and 6; compare each with its original cell by cell.
    const expected: [number, string][] = [];
    for (const [k, row] of [1, 2, 6].entries()) {
      const before = given[row] as string[];
      const after = clean[k + 1] as string[];
      header.forEach((name, c) => {
        if (before[c] !== after[c]) expected.push([row, name]);
      });
    }
    expect(changes.map((e) => [e.row, e.column])).toEqual(expected);
    expect(expected.length).toBeGreaterThan(8);
    for (const e of changes) {
      if (e.masked) continue;
      const row = e.row;
      const c = header.indexOf(e.column ?? "");
      expect(e.before).toBe(given[row]?.[c]);
      expect(e.line).toBe(row + 1);
    }
    expect(log.filter((e) => e.rejected).map((e) => e.row)).toEqual([3, 4, 5]);
  });

  test("sensitive cells are masked in the log and never appear on stderr", async () => {
    const r = await fixRun(CONTRACT, DATA);
    open.push(r.p);
    const contact = logEntries(r.log ?? "").filter((e) => e.column === "contact");
    expect(contact).toEqual([{ row: 1, line: 2, column: "contact", repair: "trim", before: mask("  kim.tan@example.org "), after: mask("kim.tan@example.org"), masked: true }]);
    expect(r.log).not.toContain("kim.tan");
    expect(r.ran.stderr).not.toContain("kim.tan");
    expect(r.ran.stderr).not.toContain("Ridge");
    // The clean file is the data itself: the repaired value is there.
    expect(records(r.out ?? "")[1]?.[7]).toBe("kim.tan@example.org");
  });

  test("the clean file meets the same contract under tablegate check", async () => {
    const r = await fixRun(CONTRACT, DATA);
    open.push(r.p);
    const before = await r.p.run(["check", "d.csv", "--contract", "c.yaml"]);
    expect(before.code).toBe(1);
    const after = await r.p.run(["check", "out.csv", "--contract", "c.yaml", "--report", "json=-"]);
    expect(after.code).toBe(0);
    const report = JSON.parse(after.stdout) as { counts: { error: number; warning: number }; input: { rows: number } };
    expect(report.counts).toMatchObject({ error: 0, warning: 0 });
    expect(report.input.rows).toBe(3);
  });

  test("the same inputs give the same bytes", async () => {
    const a = await fixRun(CONTRACT, DATA);
    const b = await fixRun(CONTRACT, DATA);
    open.push(a.p, b.p);
    expect(a.out).toBeDefined();
    expect([b.out, b.rejects, b.log, b.ran.stderr, b.ran.code]).toEqual([a.out, a.rejects, a.log, a.ran.stderr, a.ran.code]);
    // No temporary file is left beside the outputs.
    expect((await readdir(a.p.dir)).filter((f) => f.endsWith(".tmp"))).toEqual([]);
  });

  test("exit 0 when every record is clean after repair", async () => {
    const r = await fixRun(CONTRACT, `${LINES[0]}\n${LINES[1]}\n${LINES[6]}\n`);
    open.push(r.p);
    expect(r.ran.code).toBe(0);
    expect(r.rejects).toBe(`_row,_line,_rules,${LINES[0]}\r\n`);
  });

  test("records that become the same after repair are whole-row duplicates: the first stays", async () => {
    const r = await fixRun(CONTRACT.replace("keys: [[order_no, line_no]]\n", ""), `${LINES[0]}\nORD-0009,1,11/24/2026,1,1.00,,yes,\nORD-0009,1,2026-11-24,1,1.00,,true,\n`);
    open.push(r.p);
    expect(r.ran.code).toBe(1);
    expect(logEntries(r.log ?? "").filter((e) => e.rejected).map((e) => [e.row, e.rules])).toEqual([[2, ["duplicates"]]]);
  });
});

describe("whole-file checks", () => {
  test("a failing group rejects no record; the run says the clean file fails it and exits 1", async () => {
    const contract = `${CONTRACT}groups:\n  - id: one-line-orders\n    by: order_no\n    assert: count() = 1\n`;
    const r = await fixRun(contract, `${LINES[0]}\n${LINES[1]}\n${LINES[2]}\n${LINES[6]}\n`);
    open.push(r.p);
    expect(r.ran.code).toBe(1);
    expect(records(r.out ?? "").length).toBe(4);
    expect(logEntries(r.log ?? "").some((e) => e.rejected)).toBe(false);
    expect(r.ran.stderr).toContain("group:one-line-orders 1");
    expect((await r.p.run(["check", "out.csv", "--contract", "c.yaml"])).code).toBe(1);
  });
});

describe("what fix refuses", () => {
  test("--out naming the delivery is refused with exit 2 and the delivery is untouched", async () => {
    const p = await project({ "c.yaml": CONTRACT, "d.csv": DATA });
    open.push(p);
    const args: string[] = [...FIX_ARGS];
    args[args.indexOf("out.csv")] = "./d.csv";
    const r = await p.run(args);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^tablegate: --out: /);
    expect(await p.read("d.csv")).toBe(DATA);
    expect(await p.exists("rejects.csv")).toBe(false);
    expect(await p.exists("log.ndjson")).toBe(false);
  });

  test("an output that is a link to the delivery is refused too, and two options naming one file", async () => {
    const p = await project({ "c.yaml": CONTRACT, "d.csv": DATA });
    open.push(p);
    await symlink(join(p.dir, "d.csv"), join(p.dir, "link.csv"));
    const viaLink = await p.run(["fix", "d.csv", "--contract", "c.yaml", "--out", "out.csv", "--rejects", "link.csv", "--log", "log.ndjson"]);
    expect(viaLink.code).toBe(2);
    expect(viaLink.stderr).toMatch(/^tablegate: --rejects: /);
    const twice = await p.run(["fix", "d.csv", "--contract", "c.yaml", "--out", "out.csv", "--rejects", "out.csv", "--log", "log.ndjson"]);
    expect(twice.code).toBe(2);
    expect(await p.read("d.csv")).toBe(DATA);
    expect(await p.exists("out.csv")).toBe(false);
  });

  test("a missing option, a missing delivery or a bad contract is exit 2", async () => {
    const p = await project({ "c.yaml": CONTRACT, "d.csv": DATA, "bad.yaml": "tablegate: 1\nname: Bad Name\ncolumns: {}\n" });
    open.push(p);
    expect((await p.run(["fix", "d.csv", "--contract", "c.yaml", "--out", "o.csv", "--rejects", "r.csv"])).code).toBe(2);
    expect((await p.run(["fix", "nope.csv", "--contract", "c.yaml", "--out", "o.csv", "--rejects", "r.csv", "--log", "l.ndjson"])).code).toBe(2);
    expect((await p.run(["fix", "d.csv", "--contract", "bad.yaml", "--out", "o.csv", "--rejects", "r.csv", "--log", "l.ndjson"])).code).toBe(2);
    expect(await p.exists("o.csv")).toBe(false);
  });

  test("a delivery that cannot be read to its end is not split (exit 2) and earlier outputs stay as they were", async () => {
    const p = await project({ "c.yaml": CONTRACT, "d.csv": `${LINES[0]}\n${LINES[1]}\nORD-0004,1,"2026-11-24,1,1.00,,no,\n`, "out.csv": "kept\n" });
    open.push(p);
    const r = await p.run(FIX_ARGS);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^tablegate: d\.csv:3: /);
    expect(await p.read("out.csv")).toBe("kept\n");
    expect(await p.exists("rejects.csv")).toBe(false);
  });
});
