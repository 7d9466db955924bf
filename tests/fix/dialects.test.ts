import { expect, test } from "vitest";
import { fixRun, logEntries, removedAfterEach } from "./helpers.js";

const open = removedAfterEach();

const COLUMNS = `columns:
  item: { type: text, required: true }
  qty: { type: integer, thousands: "," }
  sent: { type: date, format: ["%Y-%m-%d", "%m/%d/%Y"] }
`;

test("a TSV delivery is written back as TSV and its clean file passes check", async () => {
  const r = await fixRun(`tablegate: 1\nname: tsv-gear\ninput:\n  format: tsv\n${COLUMNS}`, "item\tqty\tsent\nDome Tent\t1,500\t11/24/2026\n Camp Mug \t2\t2026-11-25\n");
  open.push(r.p);
  expect(r.ran.code).toBe(0);
  expect(r.out).toBe("item\tqty\tsent\r\nDome Tent\t1500\t2026-11-24\r\nCamp Mug\t2\t2026-11-25\r\n");
  expect((await r.p.run(["check", "out.csv", "--contract", "c.yaml"])).code).toBe(0);
});

test("with header: none no header is written, and rows keep their numbers", async () => {
  const r = await fixRun(`tablegate: 1\nname: bare-gear\ninput:\n  header: none\n${COLUMNS}`, "Dome Tent,\"1,500\",11/24/2026\n,2,2026-11-25\n");
  open.push(r.p);
  expect(r.ran.code).toBe(1);
  expect(r.out).toBe("Dome Tent,1500,2026-11-24\r\n");
  expect(r.rejects).toBe("2,2,item.required,,2,2026-11-25\r\n");
  expect(logEntries(r.log ?? "").map((e) => [e.row, e.line, e.column ?? e.rules])).toEqual([[1, 1, "qty"], [1, 1, "sent"], [2, 2, ["item.required"]]]);
});

test("a windows-1252 delivery is written as UTF-8, and the run says so", async () => {
  // windows-1252 0xE9 is é and 0x80 the euro sign (WHATWG Encoding Standard, index-windows-1252).
  const data = Buffer.from("item,qty,sent\nR\xe9chaud \x80,\"1,000\",11/24/2026\n", "latin1");
  const r = await fixRun(`tablegate: 1\nname: old-gear\ninput:\n  encoding: windows-1252\n${COLUMNS}`, data);
  open.push(r.p);
  expect(r.ran.code).toBe(0);
  expect(r.out).toBe("item,qty,sent\r\nRéchaud €,1000,2026-11-24\r\n");
  expect(r.ran.stderr).toContain("windows-1252");
  // Read as UTF-8, the clean file meets the contract.
  await r.p.write("c8.yaml", `tablegate: 1\nname: old-gear\ninput:\n  encoding: utf-8\n${COLUMNS}`);
  expect((await r.p.run(["check", "out.csv", "--contract", "c8.yaml"])).code).toBe(0);
});
