/**
 * `postal` (SPEC §1.1): the postal code must follow the layout of a country named by another column
 * (ISO 3166-1 alpha-2) or by a literal alpha-2 code. A blank country leaves nothing to judge; a country
 * with no known layout gives a note-level miss.
 */
import { describe, expect, it } from "vitest";
import type { RowView } from "../../src/checks/index.js";
import type { ColumnSpec } from "../../src/contract/types.js";
import { compiled, fakeContext, judge, specErrors } from "./helpers.js";

// Declared columns: country (0), postal_code (1).
const ctx = fakeContext({ column: "postal_code", columnNames: ["country", "postal_code"], columnIndex: (n) => (n === "country" ? 0 : n === "postal_code" ? 1 : undefined) });
const row = (country: string, code: string): RowView => ({ values: [country, code], texts: [country, code] });

// USPS Publication 28, ZIP Code and ZIP+4 formats: five digits, optionally a hyphen and four digits (from memory).
const US_VALID = ["12345", "12345-6789", "00501", "99950-0001"];
const US_INVALID = ["1234", "123456", "12345-678", "12345-67890", "12345 6789", "1234a", "ABCDE", "12345-"];

describe("postal with a country column", () => {
  const spec: ColumnSpec = { type: "text", postal: "country" };
  const check = compiled("postal", spec, ctx);
  it.each(US_VALID)("US %s is valid", (code) => {
    expect(judge(check, spec, code, row("US", code))).toBeUndefined();
  });
  it.each(US_INVALID)("US %s is invalid, at the check's own level", (code) => {
    const m = judge(check, spec, code, row("US", code));
    expect(m).toBeDefined();
    expect(m?.level).toBeUndefined();
  });
  it("the country column is read case-insensitively", () => {
    expect(judge(check, spec, "12345", row("us", "12345"))).toBeUndefined();
    expect(judge(check, spec, "1234", row("us", "1234"))).toBeDefined();
  });
  it("a blank country passes whatever the code", () => {
    expect(judge(check, spec, "anything", row("", "anything"))).toBeUndefined();
  });
  it("a country with no known layout is a note, not an error", () => {
    // XX is reserved for user assignment in ISO 3166-1 and names no country (from memory).
    const m = judge(check, spec, "12345", row("XX", "12345"));
    expect(m?.level).toBe("note");
    const odd = judge(check, spec, "12345", row("U.S.", "12345"));
    expect(odd?.level).toBe("note");
  });
  it("the country is read per row", () => {
    // A five-digit code is a US ZIP but not a Canadian postal code (Canada Post: A9A 9A9, from memory).
    expect(judge(check, spec, "12345", row("US", "12345"))).toBeUndefined();
    expect(judge(check, spec, "12345", row("CA", "12345"))).toBeDefined();
  });
});

describe("postal with a literal country", () => {
  const spec: ColumnSpec = { type: "text", postal: "US" };
  const check = compiled("postal", spec, ctx);
  it("judges every cell against that country, whatever the row", () => {
    expect([...US_VALID, ...US_INVALID].map((code) => judge(check, spec, code, row("CA", code)) === undefined)).toEqual([
      ...US_VALID.map(() => true),
      ...US_INVALID.map(() => false),
    ]);
  });
  it("a literal ISO code with no known layout compiles and gives notes", () => {
    // Hong Kong (HK) is an ISO 3166-1 code; it uses no postal codes (from memory), and no layout is known.
    const hk: ColumnSpec = { type: "text", postal: "HK" };
    expect(judge(compiled("postal", hk, ctx), hk, "123", row("", "123"))?.level).toBe("note");
  });
});

describe("postal references", () => {
  it("neither a column nor an alpha-2 code is a spec error at ['postal']", () => {
    // UK is not ISO 3166-1 (the United Kingdom is GB); ZZ and XK are user-assigned codes (ISO 3166-1
    // reserves AA, QM–QZ, XA–XZ and ZZ for user assignment; from memory).
    for (const ref of ["nation", "USA", "u", "", "UK", "ZZ", "XK"]) {
      const errors = specErrors("postal", { type: "text", postal: ref }, ctx);
      expect([ref, errors.map((e) => e.path)]).toEqual([ref, [["postal"]]]);
    }
  });
  it("a column whose name looks like a code is taken as the column", () => {
    const named = fakeContext({ columnNames: ["CC", "zip"], columnIndex: (n) => (n === "CC" ? 0 : undefined) });
    const spec: ColumnSpec = { type: "text", postal: "CC" };
    expect(judge(compiled("postal", spec, named), spec, "12345", row("US", "12345"))).toBeUndefined();
  });
});

describe("a sensitive country column", () => {
  const hidden = fakeContext({
    column: "postal_code",
    columnNames: ["country", "postal_code"],
    columnIndex: (n) => (n === "country" ? 0 : n === "postal_code" ? 1 : undefined),
    sensitive: (n) => n === "country",
  });
  const spec: ColumnSpec = { type: "text", postal: "country" };
  const check = compiled("postal", spec, hidden);
  it("does not show through the postal findings, not even as the layout it implies", () => {
    for (const [country, code] of [["AD", "1234"], ["QQ", "1"], ["US", "1234"]] as const) {
      const m = judge(check, spec, code, row(country, code));
      expect(m).toBeDefined();
      const shown = `${m?.expected ?? ""} ${m?.reason ?? ""}`;
      expect([country, shown.includes(country), /ZIP|AD\d/.test(shown)]).toEqual([country, false, false]);
    }
  });
});
