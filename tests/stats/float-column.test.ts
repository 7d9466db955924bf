import { describe, expect, it } from "vitest";
import { createFloatColumn } from "../../src/stats/index.js";

describe("createFloatColumn", () => {
  it("starts empty", () => {
    const col = createFloatColumn();
    expect(col.length).toBe(0);
    expect(col.values().length).toBe(0);
    expect(col.rows().length).toBe(0);
  });

  it("grows beyond its initial capacity and keeps every value with its row", () => {
    const col = createFloatColumn(2);
    for (let i = 0; i < 1000; i++) col.push(i * 0.5 - 7, i + 1);
    expect(col.length).toBe(1000);
    const values = col.values();
    const rows = col.rows();
    expect(values).toBeInstanceOf(Float64Array);
    expect(rows).toBeInstanceOf(Uint32Array);
    expect(values.length).toBe(1000);
    expect(rows.length).toBe(1000);
    for (let i = 0; i < 1000; i++) {
      expect(values[i]).toBe(i * 0.5 - 7);
      expect(rows[i]).toBe(i + 1);
    }
  });

  it("doubles its buffer: the backing store stays within twice the length", () => {
    const col = createFloatColumn(4);
    for (let i = 0; i < 17; i++) col.push(i, i);
    // 4 → 8 → 16 → 32
    expect(col.values().buffer.byteLength).toBe(32 * 8);
    expect(col.rows().buffer.byteLength).toBe(32 * 4);
  });

  it("skips non-finite values so statistics never see them", () => {
    const col = createFloatColumn(1);
    col.push(1, 1);
    col.push(NaN, 2);
    col.push(Infinity, 3);
    col.push(-Infinity, 4);
    col.push(2, 5);
    expect(Array.from(col.values())).toEqual([1, 2]);
    expect(Array.from(col.rows())).toEqual([1, 5]);
  });

  it("falls back to the default capacity for a nonsense initial capacity", () => {
    for (const cap of [0, -3, 1.5, NaN]) {
      const col = createFloatColumn(cap);
      col.push(3, 9);
      expect(Array.from(col.values())).toEqual([3]);
    }
  });
});
