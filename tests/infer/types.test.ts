/**
 * Type decisions, one column kind at a time, on invented values. Each draft must also accept the file it
 * came from (`check` exits 0): a draft that rejects its own source would be a wrong inference.
 */
import { describe, expect, it } from "vitest";
import { column, oneColumn, roundTrip } from "./helpers.js";

async function decided(name: string, values: readonly string[]) {
  const r = await roundTrip(oneColumn(name, values));
  expect(r.check.code, r.check.stdout + r.check.stderr).toBe(0);
  return column(r.contract, name);
}

describe("numbers", () => {
  it("integers, signs included", async () => {
    expect(await decided("qty", ["1", "22", "-3", "+4"])).toMatchObject({ type: "integer", required: true });
  });

  it("0 and 1 stay integer rather than boolean", async () => {
    expect((await decided("flag", ["0", "1", "1", "0"])).type).toBe("integer");
  });

  it("integers grouped with commas declare thousands", async () => {
    expect(await decided("units", ["1,234", "12", "1,000,000"])).toMatchObject({ type: "integer", thousands: "," });
  });

  it("decimals; scale only when every value has the same digits after the mark", async () => {
    const price = await decided("price", ["1.50", "22.25", "3.00"]);
    expect(price).toMatchObject({ type: "decimal", scale: 2 });
    const ratio = await decided("ratio", ["0.5", "0.25", "1"]);
    expect(ratio.type).toBe("decimal");
    expect(ratio.scale).toBeUndefined();
  });

  it("a decimal comma, with and without a dot for thousands", async () => {
    expect(await decided("weight", ["1,5", "2,25", "10"])).toMatchObject({ type: "decimal", decimal_mark: "," });
    expect(await decided("amount", ["1.234,50", "12,00", "999,99"])).toMatchObject({ type: "decimal", decimal_mark: ",", thousands: "." });
  });

  it("percentages", async () => {
    expect(await decided("rate", ["15%", "2.5%", "0.1"])).toMatchObject({ type: "decimal", percent: true });
  });

  it("digits with a leading zero are text with a shape, not numbers", async () => {
    const zip = await decided("zip", ["08123", "12345", "90210"]);
    expect(zip).toMatchObject({ type: "text", pattern: "^[0-9]{5}$" });
  });

  it("more than 15 digits (beyond what a double holds exactly) are text too", async () => {
    const spec = await decided("account_ref", ["1234567890123456", "9876543210987654"]);
    expect(spec).toMatchObject({ type: "text", pattern: "^[0-9]{16}$" });
    expect((await decided("big_count", ["123456789012345", "1"])).type).toBe("integer");
  });
});

describe("booleans", () => {
  it("yes/no words in any case", async () => {
    expect((await decided("gift_wrap", ["yes", "No", "Y", "n", "TRUE"])).type).toBe("boolean");
  });
});

describe("dates", () => {
  it("ISO dates", async () => {
    expect(await decided("shipped", ["2026-11-17", "2026-02-28"])).toMatchObject({ type: "date", format: "%Y-%m-%d" });
  });

  it("day.month.year", async () => {
    expect(await decided("booked", ["17.11.2026", "01.02.2026"])).toMatchObject({ type: "date", format: "%d.%m.%Y" });
  });

  it("day/month/year when a day above 12 rules out month/day", async () => {
    expect(await decided("booked", ["17/11/2026", "01/02/2026"])).toMatchObject({ type: "date", format: "%d/%m/%Y" });
  });

  it("month/day/year first when both readings fit every value", async () => {
    expect(await decided("booked", ["01/02/2026", "03/04/2026"])).toMatchObject({ type: "date", format: "%m/%d/%Y" });
  });

  it("several formats in one column, listed in a fixed order", async () => {
    const spec = await decided("ship_date", ["2026-11-17", "11/18/2026", "46345", "2026-11-20"]);
    expect(spec).toMatchObject({ type: "date", format: ["%Y-%m-%d", "%m/%d/%Y", "serial-1900"] });
  });

  it("spreadsheet serial numbers and yyyymmdd are dates only in a column named like a date", async () => {
    expect(await decided("order_date", ["20261117", "20260102"])).toMatchObject({ type: "date", format: "%Y%m%d" });
    expect((await decided("batch", ["20261117", "20260102"])).type).toBe("integer");
    expect(await decided("invoiceDate", ["46343", "46344"])).toMatchObject({ type: "date", format: "serial-1900" });
    expect((await decided("amount", ["46343", "46344"])).type).toBe("integer");
  });

  it("an impossible date (Feb 30) keeps the column text", async () => {
    expect((await decided("booked", ["2026-02-28", "2026-02-30"])).type).toBe("text");
  });
});

describe("timestamps and times", () => {
  it("ISO 8601 timestamps", async () => {
    expect((await decided("received_at", ["2026-11-17T10:00:00Z", "2026-11-17 11:30:00+01:00"])).type).toBe("timestamp");
  });

  it("clock times", async () => {
    expect((await decided("opens", ["08:30", "17:45:10", "9:05"])).type).toBe("time");
  });
});

describe("text", () => {
  it("free text gets neither codes nor a pattern", async () => {
    const spec = await decided("remark", ["left at the gate", "signed by front desk", "ring twice", "no answer"]);
    expect(spec).toEqual({ type: "text", required: true });
  });

  it("one shape across values gives an anchored pattern, with words that never vary written out", async () => {
    const spec = await decided("sku", ["TENT-2041-GR", "STOVE-1102-01", "JACKT-6010-L", "MAP-0001-X"]);
    expect(spec.pattern).toBe("^[A-Z]{3,5}-[0-9]{4}-[A-Z0-9]{1,2}$");
    const inv = await decided("invoice", ["INV-2611402", "INV-2611417", "INV-2611433"]);
    expect(inv.pattern).toBe("^INV-[0-9]{7}$");
  });

  it("emails get format email (the project's own format check) and are marked sensitive", async () => {
    const spec = await decided("reply_to", ["orders@d1042.example.org", "a.b@d1107.example.com"]);
    expect(spec).toMatchObject({ type: "text", format: "email", sensitive: true });
  });

  it("a column with no values is text and not required", async () => {
    const r = await roundTrip("a,b\n1,\n2,\n");
    expect(r.check.code).toBe(0);
    expect(column(r.contract, "b")).toEqual({ type: "text" });
  });
});
