/** Blank cells and markers, required, padded cells, and code lists in drafts, on invented data. */
import { describe, expect, it } from "vitest";
import type { DeliveryReport } from "../../src/report/model.js";
import { column, csv, oneColumn, roundTrip } from "./helpers.js";

const report = (stdout: string) => JSON.parse(stdout) as DeliveryReport;

describe("blanks and required", () => {
  it("required when no cell is blank; not when one is", async () => {
    const r = await roundTrip(csv(["id", "note"], [["1", "fragile"], ["2", ""], ["3", "  "]]));
    expect(r.check.code).toBe(0);
    expect(column(r.contract, "id").required).toBe(true);
    expect(column(r.contract, "note").required).toBeUndefined();
    expect(r.contract.input?.blank).toEqual([""]);
  });

  it("a marker in a typed column is proposed as blank, file-wide, in a fixed order", async () => {
    const data = csv(["qty", "price", "region"], [["1", "2.50", "WEST"], ["NULL", "N/A", "NA"], ["3", "NA", "SOUTH"], ["4", "1.25", "WEST"]]);
    const r = await roundTrip(data);
    expect(r.check.code).toBe(0);
    expect(r.contract.input?.blank).toEqual(["", "NA", "N/A", "NULL"]);
    expect(column(r.contract, "qty")).toMatchObject({ type: "integer" });
    expect(column(r.contract, "qty").required).toBeUndefined();
    expect(column(r.contract, "price").type).toBe("decimal");
    // NA is blank file-wide, so the text column holding it is not required either
    expect(column(r.contract, "region").required).toBeUndefined();
  });

  it("a marker found only in text columns stays a value (NA can be a country code)", async () => {
    const data = csv(["country", "qty"], [["NA", "1"], ["ZA", "2"], ["NA", "3"], ["BW", "4"], ["ZA", "5"], ["NA", "6"], ["BW", "7"], ["ZA", "8"], ["NA", "9"]]);
    const r = await roundTrip(data);
    expect(r.check.code).toBe(0);
    expect(r.contract.input?.blank).toEqual([""]);
    expect(column(r.contract, "country")).toEqual({ type: "text", required: true, codes: ["BW", "NA", "ZA"] });
  });

  it("padded cells leave spaces at its default, so check warns and still passes", async () => {
    const r = await roundTrip(csv(["sku", "qty"], [[" TENT-2041", "1"], ["STOVE-1102 ", "2"], ["MAP-0001", "3"]]));
    expect(column(r.contract, "sku").spaces).toBeUndefined();
    expect(column(r.contract, "sku").pattern).toBe("^[A-Z]{3,5}-[0-9]{4}$");
    expect(r.check.code).toBe(0);
    const spaces = report(r.check.stdout).findings.filter((f) => f.rule === "sku.spaces");
    expect(spaces.map((f) => [f.line, f.level])).toEqual([[2, "warning"], [3, "warning"]]);
  });
});

describe("codes", () => {
  it("at most 12 distinct values, each seen 3 times on average: a sorted list", async () => {
    const values = ["WEST", "SOUTH", "NORTHEAST", "WEST", "MIDWEST", "SOUTH", "WEST", "NORTHEAST", "MIDWEST", "SOUTH", "WEST", "MIDWEST"];
    const r = await roundTrip(oneColumn("sales_region", values));
    expect(r.check.code).toBe(0);
    expect(column(r.contract, "sales_region").codes).toEqual(["MIDWEST", "NORTHEAST", "SOUTH", "WEST"]);
  });

  it("too few rows for the distinct values: no list", async () => {
    const r = await roundTrip(oneColumn("sales_region", ["WEST", "SOUTH", "NORTHEAST", "WEST", "MIDWEST", "SOUTH", "WEST", "NORTHEAST", "MIDWEST", "SOUTH", "WEST"]));
    expect(column(r.contract, "sales_region").codes).toBeUndefined();
  });

  it("13 distinct values: no list, whatever the row count", async () => {
    const values = Array.from({ length: 13 * 4 }, (_v, i) => `CAT-${String.fromCharCode(65 + (i % 13))}`);
    const r = await roundTrip(oneColumn("category", values));
    expect(r.check.code).toBe(0);
    expect(column(r.contract, "category").codes).toBeUndefined();
    expect(column(r.contract, "category").pattern).toBe("^CAT-[A-Z]$");
  });

  it("codes that look like numbers stay strings in the YAML", async () => {
    const r = await roundTrip(oneColumn("bin", ["007", "012", "007", "012", "007", "012"]));
    expect(r.check.code).toBe(0);
    expect(column(r.contract, "bin").codes).toEqual(["007", "012"]);
  });

  it("numbers never get a code list", async () => {
    const r = await roundTrip(oneColumn("pack_size", ["1", "6", "12", "6", "1", "12", "6", "1", "12"]));
    expect(column(r.contract, "pack_size")).toEqual({ type: "integer", required: true });
  });
});
