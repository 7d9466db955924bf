import { describe, expect, test } from "vitest";
import { fixRun, logEntries, records, removedAfterEach } from "./helpers.js";

const open = removedAfterEach();

/** Fix a one-column delivery; return the clean cells of that column and the log. */
async function fixColumn(column: string, cells: readonly string[], input = "") {
  // One column: repaired cells often repeat one another, so whole-row duplicates are off here.
  const contract = `tablegate: 1\nname: gear-repairs\nduplicates: off\n${input}columns:\n  v: ${column}\n`;
  const data = `v\n${cells.map((c) => (c.includes(",") || c.includes('"') ? `"${c.replace(/"/g, '""')}"` : c)).join("\n")}\n`;
  const r = await fixRun(contract, data);
  open.push(r.p);
  const out = records(r.out ?? "");
  return { code: r.ran.code, stderr: r.ran.stderr, header: out[0], clean: out.slice(1).map((rec) => rec[0]), log: logEntries(r.log ?? "") };
}

describe("trim", () => {
  test("leading and trailing spaces go, inner spaces stay", async () => {
    const r = await fixColumn("{ type: text }", ["  Trail Tent 2P ", "Camp Stove", "\tHead Lamp"]);
    expect(r.code).toBe(0);
    expect(r.clean).toEqual(["Trail Tent 2P", "Camp Stove", "Head Lamp"]);
    expect(r.log.map((e) => [e.row, e.line, e.repair, e.before, e.after])).toEqual([
      [1, 2, "trim", "  Trail Tent 2P ", "Trail Tent 2P"],
      [3, 4, "trim", "\tHead Lamp", "Head Lamp"],
    ]);
  });

  test("spaces check flags and fix trims the same cells: ideographic and no-break spaces at both ends too", async () => {
    // ECMA-262 String.prototype.trim removes U+3000 and U+00A0; the engine reports them as spaces.
    const r = await fixColumn("{ type: text }", ["\u3000Trail Tent\u3000", "\u00a0Camp Stove\u00a0"]);
    expect(r.clean).toEqual(["Trail Tent", "Camp Stove"]);
    expect(r.log.map((e) => e.repair)).toEqual(["trim", "trim"]);
  });

  test("a column with spaces: allow keeps them", async () => {
    const r = await fixColumn("{ type: text, spaces: allow }", ["  Trail Tent ", "Camp Stove"]);
    expect(r.clean).toEqual(["  Trail Tent ", "Camp Stove"]);
    expect(r.log).toEqual([]);
  });

  test("with spaces: allow a typed rewrite keeps the spaces around the value", async () => {
    const r = await fixColumn("{ type: boolean, spaces: allow }", [" yes  "]);
    expect(r.clean).toEqual([" true  "]);
    expect(r.log.map((e) => e.repair)).toEqual(["boolean"]);
  });
});

describe("blank", () => {
  test("a blank marker from input.blank becomes the empty cell; other text stays", async () => {
    const r = await fixColumn("{ type: integer }", ["NA", "12", " N/A ", "NaN"], 'input:\n  blank: ["NA", "N/A"]\n');
    // "NaN" is no marker and no integer: the record is rejected, nothing guessed.
    expect(r.clean).toEqual(["", "12", ""]);
    expect(r.log.filter((e) => !e.rejected).map((e) => [e.row, e.repair, e.before, e.after])).toEqual([
      [1, "blank", "NA", ""],
      [3, "trim+blank", " N/A ", ""],
    ]);
    expect(r.log.filter((e) => e.rejected).map((e) => [e.row, e.rules])).toEqual([[4, ["v.type"]]]);
    expect(r.code).toBe(1);
  });

  test("a blank marker is not filled in: a required column rejects the record", async () => {
    const r = await fixColumn("{ type: text, required: true }", ["NA", "Camp Stove"], 'input:\n  blank: ["NA"]\n');
    expect(r.clean).toEqual(["Camp Stove"]);
    expect(r.log.map((e) => [e.row, e.rejected, e.rules])).toEqual([[1, true, ["v.required"]]]);
  });
});

describe("date", () => {
  test("a date read under one of the column's formats is written as ISO 8601", async () => {
    const r = await fixColumn('{ type: date, format: ["%Y-%m-%d", "%m/%d/%Y", "%d %b %Y"] }', ["11/24/2026", "2026-11-25", "02 Mar 2027"]);
    expect(r.code).toBe(0);
    expect(r.clean).toEqual(["2026-11-24", "2026-11-25", "2027-03-02"]);
    expect(r.log.map((e) => [e.row, e.repair, e.before, e.after])).toEqual([
      [1, "date", "11/24/2026", "2026-11-24"],
      [3, "date", "02 Mar 2027", "2027-03-02"],
    ]);
  });

  test("serial-1900 day numbers become ISO dates", async () => {
    const r = await fixColumn('{ type: date, format: ["%Y-%m-%d", serial-1900] }', ["25569", "45000", "61"]);
    // ECMA-376 Part 4 (Office Open XML), 1900 date system: serial 25569 is 1970-01-01, and the system
    // counts a 29 February 1900, so from serial 61 on day N is 1899-12-30 plus N days.
    const iso = (n: number) => new Date(Date.UTC(1899, 11, 30) + n * 86_400_000).toISOString().slice(0, 10);
    expect(r.clean).toEqual(["1970-01-01", iso(45000), "1900-03-01"]);
    expect(iso(25569)).toBe("1970-01-01");
  });

  test("a column that does not accept ISO dates keeps its cells, so the clean file still meets it", async () => {
    const r = await fixColumn('{ type: date, format: "%m/%d/%Y" }', ["11/24/2026"]);
    expect(r.code).toBe(0);
    expect(r.clean).toEqual(["11/24/2026"]);
    expect(r.log).toEqual([]);
  });

  test("a timestamp is written as ISO 8601; one with an offset in UTC, the instant kept", async () => {
    const r = await fixColumn('{ type: timestamp, format: ["iso-8601", "%m/%d/%Y %H:%M", "%Y-%m-%d %H:%M:%S%z"] }', ["11/24/2026 14:05", "2026-11-24 09:30:00+0100"]);
    expect(r.clean).toEqual(["2026-11-24T14:05:00", "2026-11-24T08:30:00Z"]);
    // The instant is the same one JavaScript's Date reads from the ISO 8601 form of the original.
    expect(Date.parse(r.clean[1] as string)).toBe(Date.parse("2026-11-24T09:30:00+01:00"));
  });

  test("an impossible date is not guessed: the record is rejected as written", async () => {
    const r = await fixColumn('{ type: date, format: ["%Y-%m-%d", "%m/%d/%Y"] }', ["02/30/2026"]);
    expect(r.code).toBe(1);
    expect(r.clean).toEqual([]);
    expect(r.log.map((e) => e.rules)).toEqual([["v.type"]]);
  });
});

describe("number", () => {
  test("thousands separators go, digits stay as written", async () => {
    const r = await fixColumn('{ type: decimal, thousands: "," }', ["1,234.50", "12,345,678.000", "-1,000", "7.10"]);
    expect(r.clean).toEqual(["1234.50", "12345678.000", "-1000", "7.10"]);
    expect(r.log.map((e) => e.before)).toEqual(["1,234.50", "12,345,678.000", "-1,000"]);
  });

  test("integers with thousands separators", async () => {
    const r = await fixColumn('{ type: integer, thousands: "," }', ["1,200", "+3", "12"]);
    expect(r.clean).toEqual(["1200", "+3", "12"]);
  });

  test("a percent becomes a fraction by moving the point, not through a double", async () => {
    const r = await fixColumn("{ type: decimal, percent: true }", ["15%", "12.5%", "0.07%", "150%", "0.2"]);
    expect(r.clean).toEqual(["0.15", "0.125", "0.0007", "1.50", "0.2"]);
    expect(r.log.every((e) => e.repair === "number")).toBe(true);
  });

  test('a "," decimal column loses its grouping but keeps its mark, which is what its contract accepts', async () => {
    const r = await fixColumn('{ type: decimal, decimal_mark: ",", thousands: "." }', ["1.234,50", "12,5", "1.000"]);
    expect(r.code).toBe(0);
    expect(r.clean).toEqual(["1234,50", "12,5", "1000"]);
  });

  test("a percent rewrite that would break scale is not made", async () => {
    const r = await fixColumn("{ type: decimal, percent: true, scale: 2 }", ["12.5%", "15%"]);
    expect(r.code).toBe(0);
    // 0.125 has three decimals; 0.15 has two.
    expect(r.clean).toEqual(["12.5%", "0.15"]);
  });

  test("nothing is rounded: too many decimals stay and reject the record", async () => {
    const r = await fixColumn("{ type: decimal, scale: 2 }", ["1.005", "2.50"]);
    expect(r.clean).toEqual(["2.50"]);
    expect(r.log.map((e) => [e.row, e.rules])).toEqual([[1, ["v.scale"]]]);
  });
});

describe("boolean", () => {
  test("yes/Y/1 become true and no/N/0 false; true and false stay", async () => {
    const r = await fixColumn("{ type: boolean }", ["yes", "Y", "1", "no", "N", "0", "true", "FALSE"]);
    expect(r.clean).toEqual(["true", "true", "true", "false", "false", "false", "true", "false"]);
    expect(r.log.map((e) => e.row)).toEqual([1, 2, 3, 4, 5, 6, 8]);
  });

  test("a column whose values do not list true/false keeps its words", async () => {
    const r = await fixColumn("{ type: boolean, values: { true: [J, ja], false: [N, nein] } }", ["ja", "N"]);
    expect(r.clean).toEqual(["ja", "N"]);
    expect(r.log).toEqual([]);
  });
});
