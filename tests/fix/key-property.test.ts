import { expect, test } from "vitest";
import { mulberry32 } from "../../src/bench/prng.js";
import { fixRun, logEntries, records, removedAfterEach } from "./helpers.js";

const open = removedAfterEach();

// Invented tent and stove orders; every column type, messy spellings, some records beyond repair.
const CONTRACT = `tablegate: 1
name: trail-orders
input:
  delimiter: ";"
  blank: ["NA", "-"]
keys: [sku]
columns:
  sku: { type: text, required: true, pattern: '^SKU-[0-9]{3}$' }
  ordered: { type: date, required: true, format: ["%Y-%m-%d", "%d/%m/%Y", serial-1900], min: "2020-01-01" }
  packed_at: { type: timestamp, format: ["iso-8601", "%d/%m/%Y %H:%M"] }
  qty: { type: integer, min: 1, thousands: "." }
  price: { type: decimal, decimal_mark: ",", thousands: ".", scale: 2, min: 0 }
  margin: { type: decimal, percent: true, min: 0, max: 0.9 }
  in_stock: { type: boolean }
  note: { type: text, max_length: 12, spaces: allow }
  email: { type: text, format: email, sensitive: true }
rules:
  - id: packed-after-ordered
    assert: packed_at IS NULL OR packed_at >= ordered
`;

const pick = <T>(rnd: () => number, xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)] as T;

function delivery(seed: number, rows: number): string {
  const rnd = mulberry32(seed);
  const lines = ["sku;ordered;packed_at;qty;price;margin;in_stock;note;email"];
  for (let i = 0; i < rows; i++) {
    const day = 1 + Math.floor(rnd() * 28);
    const dd = String(day).padStart(2, "0");
    const sku = rnd() < 0.05 ? "SKU-001" : `SKU-${String(100 + i).padStart(3, "0")}`;
    const ordered = pick(rnd, [`2026-03-${dd}`, `${dd}/03/2026`, ` ${dd}/03/2026`, String(46082 + day), "NA", "31/02/2026"]);
    const packed = pick(rnd, ["", `2026-04-01T10:00:00`, `01/04/2026 10:00`, `01/01/2019 08:00`, "-"]);
    const qty = pick(rnd, ["1", "1.200", " 12 ", "0", "NA", "3"]);
    const price = pick(rnd, ["1.234,50", "19,99", "5", "2,999", "-1,00", " 7,5 "]);
    const margin = pick(rnd, ["15%", "0.2", "12.5%", "95%", "", "30 %"]);
    const stock = pick(rnd, ["yes", "N", "1", "TRUE", "maybe", "0"]);
    const note = pick(rnd, ["  fragile ", "gift", "", "a very long note here", "NA"]);
    const email = pick(rnd, ["kai@example.org", " ren@example.net", "not-an-email", "NA"]);
    lines.push([sku, ordered, packed, qty, price, margin, stock, note, email].join(";"));
  }
  return `${lines.join("\n")}\n`;
}

test.each([1, 2, 3, 4, 5])("seed %i: the clean file meets the contract, and every record lands in exactly one file", async (seed) => {
  const data = delivery(seed, 80);
  const r = await fixRun(CONTRACT, data);
  open.push(r.p);
  expect(r.ran.code).toBe(1);
  const check = await r.p.run(["check", "out.csv", "--contract", "c.yaml", "--report", "json=-"]);
  expect(check.stderr).toBe("");
  expect(check.code).toBe(0);
  const given = records(data, ";");
  const clean = records(r.out ?? "", ";");
  const rejects = records(r.rejects ?? "", ";");
  expect(clean.length - 1 + rejects.length - 1).toBe(given.length - 1);
  expect(clean.length).toBeGreaterThan(5);
  // Each rejected record is the delivery's record at its _row, cell for cell.
  for (const rej of rejects.slice(1)) expect(rej.slice(3)).toEqual(given[Number(rej[0])]);
  // The delivery exercises every repair.
  const kinds = new Set(logEntries(r.log ?? "").flatMap((e) => (e.repair ?? "").split("+")));
  for (const k of ["trim", "blank", "date", "number", "boolean"]) expect(kinds).toContain(k);
  // The log's changes, applied to the clean records' originals, give the clean file.
  const log = logEntries(r.log ?? "");
  const header = given[0] as string[];
  const rejected = new Set(rejects.slice(1).map((x) => Number(x[0])));
  const rebuilt = [header];
  for (let row = 1; row < given.length; row++) {
    if (rejected.has(row)) continue;
    const cells = [...(given[row] as string[])];
    for (const e of log) {
      if (e.row !== row || e.rejected) continue;
      const c = header.indexOf(e.column ?? "");
      if (!e.masked) expect(cells[c]).toBe(e.before);
      cells[c] = e.masked ? (clean[rebuilt.length]?.[c] as string) : (e.after as string);
    }
    rebuilt.push(cells);
  }
  expect(rebuilt).toEqual(clean);
});
