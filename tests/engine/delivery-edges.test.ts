/**
 * Shapes real deliveries take that the golden suite does not: line ends, quoting of the header,
 * delimiters, blank lines, whitespace-only cells. Expected results from SPEC §1.1/§1.4/§4 and RFC 4180.
 */
import { describe, expect, it } from "vitest";
import { checkJson } from "../helpers/cli.js";
import { checkOf, expectFinding, expectNoFinding } from "../helpers/findings.js";

const items = "tablegate: 1\nname: items\ninput: { header: exact }\ncolumns:\n  id: { type: integer }\n  item: { type: text, required: true }\n";

describe("delivery edges", () => {
  it("no newline after the last record: the record still counts", async () => {
    const { code, report } = await checkJson(items, "id,item\n1,tent\nx,stove");
    expect({ code, rows: report.input.rows }).toEqual({ code: 1, rows: 2 });
    expectFinding(report, { rule: "id.type", row: 2, line: 3, column: "id", level: "error", value: "x" });
  });

  it("a quoted header (RFC 4180 allows quoting any field) matches the declared names", async () => {
    const { code, report } = await checkJson(items, '"id","item"\n"1","tent"\n');
    expect({ code, findings: report.findings }).toEqual({ code: 0, findings: [] });
  });

  it("a semicolon delimiter with decimal comma", async () => {
    const contract = 'tablegate: 1\nname: semi\ninput: { delimiter: ";" }\ncolumns:\n  sku: { type: text }\n  price: { type: decimal, decimal_mark: ",", max: 10 }\n';
    const { report } = await checkJson(contract, "sku;price\nA;1,50\nB;12,00\n");
    expect(report.input.rows).toBe(2);
    expectFinding(report, { rule: "price.max", row: 2, line: 3, column: "price", level: "error", value: "12,00" });
    expect(report.findings).toHaveLength(1);
  });

  it("old Mac CR-only line ends still split records", async () => {
    const { report } = await checkJson(items, "id,item\r1,tent\rx,stove\r");
    expect(report.input.rows).toBe(2);
    expectFinding(report, { rule: "id.type", row: 2, line: 3, column: "id", level: "error" });
  });

  it("a whitespace-only cell is blank: required fails", async () => {
    const { report } = await checkJson(items, "id,item\n1,   \n");
    expectFinding(report, { rule: "item.required", row: 1, line: 2, column: "item", level: "error" });
  });

  it("key values are compared after trimming (cells are trimmed before every check)", async () => {
    const contract = "tablegate: 1\nname: k\ncolumns:\n  sku: { type: text }\n  n: { type: integer }\nkeys: [sku]\n";
    const { report } = await checkJson(contract, "sku,n\nA,1\n A,2\n");
    expectFinding(report, { rule: "key:sku", row: 2, line: 3, level: "error" });
    expectFinding(report, { rule: "sku.spaces", row: 2, line: 3, level: "warning" });
  });

  it("a header-only file with header: exact passes with zero rows", async () => {
    const { code, report } = await checkJson(items, "id,item\n");
    expect({ code, rows: report.input.rows, findings: report.findings.length }).toEqual({ code: 0, rows: 0, findings: 0 });
  });

  it("a zero-byte file cannot show the declared header: header.missing for each column", async () => {
    const { code, report } = await checkJson(items, "");
    expect(code).toBe(1);
    expectFinding(report, { rule: "header.missing", column: "id" });
    expectFinding(report, { rule: "header.missing", column: "item" });
  });

  it("a required column missing from the header is reported once, not once per row", async () => {
    const { report } = await checkJson(items.replace("header: exact", "header: any-order"), "id\n1\n2\n3\n");
    expect(checkOf(report, "header.missing").failed).toBe(1);
    expectNoFinding(report, { rule: "item.required", row: 2 });
  });

  it("a ragged record is not a whole-row duplicate candidate and not key-checked", async () => {
    const contract = "tablegate: 1\nname: k\ncolumns:\n  id: { type: integer }\n  v: { type: text }\nkeys: [id]\n";
    const { report } = await checkJson(contract, "id,v\n1,a\n1\n1\n");
    expect(checkOf(report, "row.width").failed).toBe(2);
    // One cell is "1 cell", not "1 cells"; the header's two are "2 cells".
    const width = expectFinding(report, { rule: "row.width", row: 2, line: 3, value: "1" });
    expect(width.expected).toBe("2 cells");
    expect(width.message).toMatch(/\b1 cell\b/);
    expect(width.message).not.toContain("1 cells");
    expect(checkOf(report, "key:id").failed).toBe(0);
    expect(checkOf(report, "duplicates").failed).toBe(0);
  });
});

describe("blank lines", () => {
  it("an empty line between records is skipped; the next record keeps its physical line", async () => {
    const { report } = await checkJson(items, "id,item\n1,tent\n\nx,stove\n");
    expect(report.input.rows).toBe(2);
    expectFinding(report, { rule: "id.type", row: 2, line: 4, column: "id", level: "error" });
    expect(report.findings).toHaveLength(1);
  });

  it("a trailing empty line is not a record", async () => {
    const { code, report } = await checkJson(items, "id,item\n1,tent\n\n");
    expect({ code, rows: report.input.rows, findings: report.findings }).toEqual({ code: 0, rows: 1, findings: [] });
  });
});
