// Prepared rows carry each parsed cell as a number; the main thread rebuilds the Value from it. For
// every column type, preparing then rebuilding must give exactly what the column's parser gives.
import { describe, expect, it } from "vitest";
import type { ColumnSpec } from "../../src/contract/types.js";
import { createPreparer, numberSlots, PARSED } from "../../src/engine/prepare.js";
import { createValueRebuilder } from "../../src/engine/rebuild-value.js";
import { compileType } from "../../src/types/index.js";

const cases: [ColumnSpec, string[]][] = [
  [{ type: "integer" }, ["0", "-17", "12345678901234567890", "007"]],
  [{ type: "decimal" }, ["0.1", "-0.00", "12.90", "1e3", "3.14159"]],
  [{ type: "boolean" }, ["true", "false", "yes"]],
  [{ type: "date", format: ["%Y-%m-%d", "%m/%d/%Y", "serial-1900"] }, ["1969-12-31", "2026-02-28", "11/25/2026", "45000"]],
  [{ type: "timestamp" }, ["2026-01-01T00:00:00Z", "2026-01-01T00:00:00", "2026-01-01T01:00:00+01:00", "1960-06-30T12:00:00.250Z"]],
  [{ type: "time" }, ["00:00", "23:59:59", "7:05"]],
  [{ type: "text" }, ["abc", "a b"]],
];

describe("rebuilt values", () => {
  it("equal what each column's parser gives, for every type", () => {
    const columns = cases.map(([spec]) => spec);
    const width = columns.length;
    const rows = Math.max(...cases.map(([, texts]) => texts.length));
    const records = Array.from({ length: rows }, (_, r) => ({ cells: cases.map(([, texts]) => texts[r % texts.length] as string), line: r + 2 }));
    const prepared = createPreparer({ columns, blank: [], keys: [], duplicates: false }, { positions: Int32Array.from(columns, (_, i) => i), width }).prepare(records, 0, rows);
    const { slots, count } = numberSlots(columns.map((c) => c.type));
    const rebuild = createValueRebuilder(columns.map((c) => c.type));
    let compared = 0;
    for (let r = 0; r < rows; r++) {
      for (let i = 0; i < width; i++) {
        const text = records[r]?.cells[i] as string;
        const parser = compileType(columns[i] as ColumnSpec);
        if (!parser.ok) throw new Error("a case's column does not compile");
        const direct = parser.parser.parse(text);
        const flags = prepared.states[r * width + i] as number;
        if (direct === undefined) {
          expect(flags & 3, `${text} as ${columns[i]?.type}`).not.toBe(PARSED);
          continue;
        }
        const x = prepared.numbers[r * count + (slots[i] as number)] as number;
        expect(rebuild(i, text, x, flags), `${text} as ${columns[i]?.type}`).toEqual(direct);
        compared++;
      }
    }
    expect(compared).toBeGreaterThan(20);
  });

  it("a run of equal dates shares one value object; a new date makes a new one", () => {
    const rebuild = createValueRebuilder(["date"]);
    const a = rebuild(0, "x", 100, 0);
    expect(rebuild(0, "x", 100, 0)).toBe(a);
    expect(rebuild(0, "x", 101, 0)).toEqual({ kind: "date", days: 101 });
  });
});
