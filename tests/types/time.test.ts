import { describe, expect, it } from "vitest";
import { timeValue } from "../../src/values.js";
import { errorsFor, parserFor } from "./helpers.js";

describe("time, default hh:mm[:ss]", () => {
  const p = parserFor({ type: "time" });
  it.each([
    ["00:00", 0],
    ["09:05", 9 * 3600 + 5 * 60],
    ["9:05", 9 * 3600 + 5 * 60],
    ["23:59:59", 86_399],
    ["12:30:15", 45_015],
    ["7:00:01", 25_201],
  ])("accepts %s", (text, seconds) => {
    expect(p.parse(text)).toEqual(timeValue(seconds));
  });
  it.each(["24:00", "24:00:00", "23:60", "23:59:60", "12", "12:5", "12:05:1", "12:05:", "12.05", "123:00", "12:00:00.5", "12:00Z", "-1:00", "1:00 PM", "::00", ";:30", "=:05:00", "?:59", "/:00", " 9:00"])(
    "rejects %s",
    (text) => {
      expect(p.parse(text)).toBeUndefined();
    },
  );
});

describe("time patterns", () => {
  it("reads %H %M %S in any layout", () => {
    const p = parserFor({ type: "time", format: ["%Hh%M", "%H%M%S"] });
    expect(p.parse("9h05")).toEqual(timeValue(9 * 3600 + 5 * 60));
    expect(p.parse("090530")).toEqual(timeValue(9 * 3600 + 5 * 60 + 30));
    expect(p.parse("9530")).toBeUndefined();
    expect(p.parse("24h00")).toBeUndefined();
    expect(p.expected).toBe("a time as %Hh%M or %H%M%S");
  });
  it("rejects date directives and incomplete patterns", () => {
    expect(errorsFor({ type: "time", format: ["%H:%M", "%Y %H:%M"] }).map((e) => e.path)).toEqual([["format", 1]]);
    expect(errorsFor({ type: "time", format: "%H" }).map((e) => e.path)).toEqual([["format"]]);
    expect(errorsFor({ type: "time", format: "%H:%M %z" }).map((e) => e.path)).toEqual([["format"]]);
  });
});
