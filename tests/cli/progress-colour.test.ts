import { describe, expect, it } from "vitest";
import { createProgress } from "../../src/cli/progress.js";
import { paint, wantColour } from "../../src/report/colour.js";

describe("progress line", () => {
  it("stays silent for the first second, then rewrites one line with rows, MB, rate and time left", () => {
    let t = 0;
    const out: string[] = [];
    let bytes = 0;
    const p = createProgress((s) => out.push(s), "w48.csv", 100e6, () => bytes, () => t);
    t = 900;
    bytes = 10e6;
    p.update(90_000);
    expect(out).toEqual([]);
    t = 2000;
    bytes = 25e6;
    p.update(200_000);
    expect(out).toHaveLength(1);
    expect(out[0]).toMatch(/^\r\x1b\[K/);
    // 200,000 rows in 2 s; a quarter of the bytes in 2 s leaves three quarters: 6 s.
    expect(out[0]).toContain("200,000 rows");
    expect(out[0]).toContain("25.0 of 100.0 MB");
    expect(out[0]).toContain("100,000 rows/s");
    expect(out[0]).toContain("about 6 s left");
    t = 2100;
    p.update(210_000);
    expect(out).toHaveLength(1); // at most four updates a second
    p.done();
    expect(out[1]).toBe("\r\x1b[K");
  });

  it("erases nothing when nothing was shown", () => {
    const out: string[] = [];
    const p = createProgress((s) => out.push(s), "f", 1, () => 0, () => 0);
    p.update(1);
    p.done();
    expect(out).toEqual([]);
  });
});

describe("colour", () => {
  // no-color.org: NO_COLOR set to a non-empty value disables colour.
  it("is off with NO_COLOR, even when forced or on a terminal", () => {
    expect(wantColour({ NO_COLOR: "1" }, true)).toBe(false);
    expect(wantColour({ NO_COLOR: "1", FORCE_COLOR: "1" }, true)).toBe(false);
  });
  it("follows the terminal otherwise, and FORCE_COLOR forces it", () => {
    expect(wantColour({}, true)).toBe(true);
    expect(wantColour({}, false)).toBe(false);
    expect(wantColour({ NO_COLOR: "" }, true)).toBe(true);
    expect(wantColour({ FORCE_COLOR: "1" }, false)).toBe(true);
    expect(wantColour({ FORCE_COLOR: "0" }, false)).toBe(false);
  });
  it("paints only when asked", () => {
    expect(paint(false, "error", "ERROR")).toBe("ERROR");
    expect(paint(true, "error", "ERROR")).toBe("\x1b[1;31mERROR\x1b[0m");
  });
});

describe("thousands", () => {
  it("groups digits by three as en-US does (Intl.NumberFormat as the reference)", async () => {
    const { thousands } = await import("../../src/report/thousands.js");
    const fmt = new Intl.NumberFormat("en-US", { maximumFractionDigits: 0 });
    for (const x of [0, 7, 999, 1000, 12345, 999999, 1000000, 1234567890, -4321, 1e15]) expect(thousands(x)).toBe(fmt.format(x));
  });
});
