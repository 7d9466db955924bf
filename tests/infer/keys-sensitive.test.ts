/** Key and duplicate proposals, and personal data in drafts, on invented data. */
import { describe, expect, it } from "vitest";
import { createKeyTracker } from "../../src/infer/key-tracker.js";
import { personalDataHint } from "../../src/infer/names.js";
import { column, csv, roundTrip } from "./helpers.js";

describe("keys", () => {
  it("the first column alone when it is unique", async () => {
    const r = await roundTrip(csv(["order_id", "sku"], [["A-1", "TENT"], ["A-2", "TENT"], ["A-3", "MAP"]]));
    expect(r.check.code).toBe(0);
    expect(r.contract.keys).toEqual(["order_id"]);
  });

  it("the first two columns together when the first repeats", async () => {
    const r = await roundTrip(csv(["invoice_no", "line_no", "qty"], [["INV-1", "1", "2"], ["INV-1", "2", "2"], ["INV-2", "1", "2"]]));
    expect(r.check.code).toBe(0);
    expect(r.contract.keys).toEqual([["invoice_no", "line_no"]]);
  });

  it("no key when neither is unique", async () => {
    const r = await roundTrip(csv(["invoice_no", "line_no", "qty"], [["INV-1", "1", "2"], ["INV-1", "1", "3"], ["INV-2", "1", "2"]]));
    expect(r.check.code).toBe(0);
    expect(r.contract.keys).toBeUndefined();
  });

  it("unique by spelling is not enough when the check compares typed values (1.5 = 1.50)", async () => {
    // spelt apart, 1.5 and 1.50 are one value to the check: the pair is proposed instead
    const r = await roundTrip(csv(["ratio", "note"], [["1.5", "a"], ["1.50", "b"], ["2", "c"]]));
    expect(column(r.contract, "ratio").type).toBe("decimal");
    expect(r.contract.keys).toEqual([["ratio", "note"]]);
    expect(r.check.code).toBe(0);
    const same = await roundTrip(csv(["ratio", "note"], [["1.5", "a"], ["1.50", "a"], ["2", "a"]]));
    expect(same.contract.keys).toBeUndefined();
    expect(same.check.code).toBe(0);
  });

  it("no key over a column with a blank", async () => {
    const r = await roundTrip(csv(["code", "name"], [["A", "x"], ["", "y"], ["C", "z"]]));
    expect(r.contract.keys).toBeUndefined();
  });

  it("a key checked only up to its cap reports capped, not unique", () => {
    const t = createKeyTracker(2, { first: 3, other: 2 });
    for (const row of [["1", "a"], ["2", "b"], ["3", "c"], ["4", "d"]]) t.observe(row);
    const outcomes = t.result((_c, text) => text).map((k) => [k.columns, k.outcome]);
    expect(outcomes).toEqual([[[0], "capped"], [[0, 1], "capped"], [[1], "capped"]]);
    const u = createKeyTracker(2, { first: 10, other: 10 });
    for (const row of [["1", "a"], ["2", "a"], ["1", "b"]]) u.observe(row);
    expect(u.result((_c, text) => text).map((k) => k.outcome)).toEqual(["repeats", "unique", "repeats"]);
  });

  it("whole-row repeats make duplicates a warning, so the file still passes", async () => {
    const r = await roundTrip(csv(["sku", "qty"], [["TENT", "1"], ["MAP", "2"], ["TENT", "1"]]));
    expect(r.contract.duplicates).toBe("warning");
    expect(r.check.code).toBe(0);
    const clean = await roundTrip(csv(["sku", "qty"], [["TENT", "1"], ["MAP", "2"], ["TENT", "2"]]));
    expect(clean.contract.duplicates).toBe("error");
  });
});

describe("personal data", () => {
  it.each([
    ["email", "email"], ["E-Mail", "email"], ["phoneNumber", "phone"], ["contact", "contact"], ["ssn", "ssn"], ["dob", "dob"],
    ["home_address", "address"], ["first_name", "first name"], ["customerName", "customer name"], ["Last Name", "last name"],
  ])("%s is personal (%s)", (name, why) => {
    expect(personalDataHint(name)).toBe(why);
  });

  it.each(["product_name", "name", "sku", "ship_date", "sales_region"])("%s is not", (name) => {
    expect(personalDataHint(name)).toBeUndefined();
  });

  it("a sensitive column is marked, and none of its values reach the draft", async () => {
    const phones = ["555-0101", "555-0199", "555-0101", "555-0199", "555-0101", "555-0199"];
    const data = csv(["order_id", "phone", "dob"], phones.map((p, i) => [`O-${i}`, p, `1990-01-0${i + 1}`]));
    const r = await roundTrip(data);
    expect(r.check.code).toBe(0);
    expect(column(r.contract, "phone")).toMatchObject({ type: "text", required: true, sensitive: true, pattern: "^[0-9]{3}-[0-9]{4}$" });
    expect(column(r.contract, "phone").codes).toBeUndefined();
    expect(column(r.contract, "dob")).toMatchObject({ type: "date", sensitive: true });
    for (const secret of ["555", "0101", "0199", "1990"]) expect(r.infer.stdout).not.toContain(secret);
  });
});
