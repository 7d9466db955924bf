// Prepared rows: what the parse thread hands the checks. Each row's cell states, values as numbers,
// and key and duplicate outcomes, pinned here on small rows worked out by hand.
import { describe, expect, it } from "vitest";
import type { ColumnSpec } from "../../src/contract/types.js";
import { ABSENT, BLANK, createPreparer, INVALID, PARSED, SPACED, ZONED, type PrepareSpec } from "../../src/engine/prepare.js";
import type { RawRecord } from "../../src/input/types.js";

const columns: ColumnSpec[] = [
  { type: "text" },
  { type: "integer" },
  { type: "date", format: "%Y-%m-%d" },
  { type: "timestamp" },
  { type: "boolean" },
  { type: "decimal" },
];
const spec: PrepareSpec = { columns, blank: ["", "NA"], keys: [[0, 1]], duplicates: true };
// The file's column order differs from the contract's; the decimal column is missing from it.
const layout = { positions: Int32Array.from([1, 0, 2, 3, 4, -1]), width: 5 };
const rec = (cells: string[]): RawRecord => ({ cells, line: 0 });

describe("prepared rows", () => {
  it("states, flags and numbers per cell", () => {
    const p = createPreparer(spec, layout);
    const out = p.prepare([rec(["7", " a ", "1970-01-03", "2026-01-01T00:00:00Z", "true"]), rec([" NA", "", "2026-02-30", "2026-01-01T00:00:00", "no"])], 0, 2);
    const n = columns.length;
    // Row 1: the text cell had spaces; 1970-01-03 is day 2; the timestamp has an offset.
    expect([...out.states.subarray(0, n)]).toEqual([SPACED | PARSED, PARSED, PARSED, PARSED | ZONED, PARSED, ABSENT]);
    // Numbers only for the columns that are not text: integer, date, timestamp, boolean, decimal.
    expect(out.numbers.length).toBe(2 * 5);
    expect([...out.numbers.subarray(0, 4)]).toEqual([7, 2, Date.UTC(2026, 0, 1), 1]);
    // Row 2, in contract order: an empty cell, a blank marker written with spaces, no 30 February, a timestamp without offset.
    expect(out.states[n + 0]).toBe(BLANK);
    expect(out.states[n + 1]).toBe(BLANK | SPACED);
    expect(out.states[n + 2]).toBe(INVALID);
    expect(out.states[n + 3]).toBe(PARSED);
  });

  it("keys with a NULL part never repeat; a repeat names the earlier row, across calls", () => {
    const p = createPreparer(spec, layout);
    const first = p.prepare([rec(["1", "a", "", "", ""]), rec(["01", "a", "", "", ""]), rec(["1", "", "", "", ""])], 0, 3);
    // Key (text, integer): `01` is the integer 1, so row 2 repeats row 1's key; row 3 has a blank part.
    expect([...first.repeats]).toEqual([0, 0, 1, 0, -1, 0]);
    const later = p.prepare([rec(["x"]), rec(["1", "a", "", "", ""]), rec(["1", "", "", "", ""])], 1, 3);
    // Rows 4 and 5 (the first record given is not among those prepared): exact copies of rows 1 and 3.
    expect([...later.repeats]).toEqual([1, 1, -1, 3]);
  });

  it("a record of the wrong width is counted as a row but left unprepared", () => {
    const p = createPreparer(spec, layout);
    const out = p.prepare([rec(["1", "a"]), rec(["1", "a", "", "", ""]), rec(["1", "a", "", "", ""])], 0, 3);
    expect([...out.states.subarray(0, columns.length)]).toEqual([0, 0, 0, 0, 0, 0]);
    expect([...out.repeats]).toEqual([0, 0, 0, 0, 2, 2]);
  });
});
