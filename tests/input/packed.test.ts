import { describe, expect, it } from "vitest";
import { packRecords, unpackRecords } from "../../src/input/packed.js";
import type { RawRecord } from "../../src/input/types.js";

const records: RawRecord[] = [
  { cells: ["id", "note"], line: 1 },
  { cells: ["1", ""], line: 2 },
  { cells: ["2", "a longer cell of more than thirteen characters"], line: 3 },
  { cells: ["3", "two\nlines", "extra"], line: 5 },
  { cells: ["4", "caf\u00e9 \u{1F3D5}\uFE0F", " spaced "], line: 7 },
  { cells: [], line: 9 },
  { cells: [""], line: 10 },
];

/** Every piece from `from` on, each at most `budget` characters of text (or one record). */
function pieces(budget: number): RawRecord[][] {
  const out: RawRecord[][] = [];
  for (let from = 0; from < records.length; ) {
    const { packed, next } = packRecords(records, from, budget);
    expect(next).toBeGreaterThan(from);
    out.push(unpackRecords(packed));
    from = next;
  }
  return out;
}

describe("packed records", () => {
  it("unpack to the records packed: cells, empty cells, ragged widths, lines, non-ASCII text", () => {
    const { packed, next } = packRecords(records);
    expect(next).toBe(records.length);
    expect(unpackRecords(packed)).toEqual(records);
  });

  it("split into pieces by a character budget, together the same records in order", () => {
    for (const budget of [1, 5, 20, 60, Infinity]) {
      const got = pieces(budget);
      expect(got.flat()).toEqual(records);
      // A record without text adds nothing to the budget, so the last two share a piece.
      if (budget === 1) expect(got.map((p) => p.length)).toEqual([1, 1, 1, 1, 1, 2]);
      if (budget === Infinity) expect(got).toHaveLength(1);
    }
  });

  it("lays out per record its cell count, its line, then each cell's length", () => {
    const { packed } = packRecords(records, 1, 0);
    expect([...packed.layout]).toEqual([2, 2, 1, 0]);
    expect(packed.text).toBe("1");
  });
});
