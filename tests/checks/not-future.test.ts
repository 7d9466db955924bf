/** `not_future: true` (SPEC §1.1): a date or timestamp no later than today, a fixed day for the whole run (UTC). */
import { describe, expect, it } from "vitest";
import type { ColumnSpec } from "../../src/contract/types.js";
import { CHECKS } from "../../src/checks/index.js";
import { compiled, fakeContext, judge } from "./helpers.js";

const today = Date.UTC(2024, 5, 15) / 86_400_000; // 2024-06-15
const ctx = fakeContext({ today });

function verdicts(spec: ColumnSpec, texts: readonly string[]): Record<string, boolean> {
  const check = compiled("not_future", spec, ctx);
  return Object.fromEntries(texts.map((t) => [t, judge(check, spec, t) === undefined]));
}

describe("not_future", () => {
  it("dates: today passes, tomorrow is future", () => {
    expect(verdicts({ type: "date", not_future: true }, ["2024-06-14", "2024-06-15", "2024-06-16", "2025-01-01", "1999-12-31"])).toEqual({
      "2024-06-14": true,
      "2024-06-15": true,
      "2024-06-16": false,
      "2025-01-01": false,
      "1999-12-31": true,
    });
  });

  it("dates in another delivery format are judged by the day they name", () => {
    expect(verdicts({ type: "date", not_future: true, format: "%m/%d/%Y" }, ["06/15/2024", "06/16/2024"])).toEqual({ "06/15/2024": true, "06/16/2024": false });
  });

  it("timestamps: the end of today (UTC) is not future; the first instant of tomorrow is", () => {
    expect(
      verdicts({ type: "timestamp", not_future: true }, ["2024-06-15T00:00:00Z", "2024-06-15T23:59:59Z", "2024-06-15T23:59:59.999Z", "2024-06-16T00:00:00Z", "2024-06-15T23:59:59"]),
    ).toEqual({
      "2024-06-15T00:00:00Z": true,
      "2024-06-15T23:59:59Z": true,
      "2024-06-15T23:59:59.999Z": true,
      "2024-06-16T00:00:00Z": false,
      "2024-06-15T23:59:59": true,
    });
  });

  it("timestamps with an offset are judged by their instant", () => {
    // 20:00 at -05:00 is 01:00Z the next day; 01:00 at +02:00 is 23:00Z the same day.
    expect(verdicts({ type: "timestamp", not_future: true }, ["2024-06-15T20:00:00-05:00", "2024-06-16T01:00:00+02:00"])).toEqual({
      "2024-06-15T20:00:00-05:00": false,
      "2024-06-16T01:00:00+02:00": true,
    });
  });

  it("not_future: false asks for nothing", () => {
    expect(CHECKS.not_future?.compile({ type: "date", not_future: false }, ctx)).toBeUndefined();
  });

  it("the day comes from the context, not the clock", () => {
    const later = fakeContext({ today: today + 1 });
    const spec: ColumnSpec = { type: "date", not_future: true };
    expect(judge(compiled("not_future", spec, later), spec, "2024-06-16")).toBeUndefined();
  });
});
