import { parse } from "csv-parse/sync";
import { describe, expect, test } from "vitest";
import type { ColumnSpec } from "../../src/contract/types.js";
import { csvLine } from "../../src/fix/csv-line.js";
import { plainNumbers } from "../../src/fix/plain-number.js";
import { compileType } from "../../src/types/index.js";

/** The value a column of this spec reads from the text, through tablegate's own parser. */
function read(spec: ColumnSpec, text: string): number {
  const t = compileType(spec);
  if (!t.ok) throw new Error("bad spec");
  const v = t.parser.parse(text);
  if (typeof v !== "number") throw new Error(`not a number: ${text}`);
  return v;
}

describe("plainNumbers", () => {
  const cases: [ColumnSpec, string, string[]][] = [
    [{ type: "decimal", thousands: "," }, "1,234.50", ["1234.50", "1234,50"]],
    [{ type: "decimal", thousands: ".", decimal_mark: "," }, "1.234,50", ["1234.50", "1234,50"]],
    [{ type: "decimal", thousands: ".", decimal_mark: "," }, "1.234", ["1234"]],
    [{ type: "decimal", thousands: " ", decimal_mark: "," }, "-12 345,6", ["-12345.6", "-12345,6"]],
    [{ type: "decimal", percent: true }, "12.5%", ["0.125", "0,125"]],
    [{ type: "decimal", percent: true }, "-3 %", ["-0.03", "-0,03"]],
    [{ type: "integer", thousands: "'" }, "1'000'000", ["1000000"]],
    [{ type: "decimal" }, "12.50", []],
    [{ type: "decimal" }, ".5", []],
    [{ type: "integer" }, "-7", []],
  ];
  test.each(cases)("%o %s", (spec, text, want) => {
    expect(plainNumbers(text, read(spec, text))).toEqual(want);
  });

  test("digits beyond a double's precision are kept as written", () => {
    const text = "12,345,678,901,234,567.891";
    expect(plainNumbers(text, read({ type: "decimal", thousands: "," }, text))[0]).toBe("12345678901234567.891");
  });

  test("a text that does not read back to the value gives nothing", () => {
    expect(plainNumbers("1,234", 1.234 + 1)).toEqual([]);
  });
});

describe("csvLine", () => {
  test("quotes only what must be quoted, doubling quotes (RFC 4180 section 2, rules 6 and 7)", () => {
    // RFC 4180 section 2 rule 7 example: "aaa","b""bb","ccc" holds the cells aaa, b"bb, ccc.
    expect(csvLine(["aaa", 'b"bb', "ccc"], { delimiter: ",", quote: '"' })).toBe('aaa,"b""bb",ccc\r\n');
    // Rule 6 example: fields with line breaks, double quotes and commas are enclosed in double quotes.
    expect(csvLine(["aaa", "b\r\nbb", "c,cc"], { delimiter: ",", quote: '"' })).toBe('aaa,"b\r\nbb","c,cc"\r\n');
  });

  test("an independent reader (csv-parse) reads back every cell as written", () => {
    const rows = [["", " padded ", 'q"uote', "semi;colon", "line\nbreak", "tab\tcell", "é€"], [""]];
    for (const delimiter of [",", ";"]) {
      const text = rows.map((r) => csvLine(r, { delimiter, quote: '"' })).join("");
      expect(parse(text, { delimiter, relax_column_count: true })).toEqual(rows);
    }
  });

  test("without a quote character (TSV) cells are joined as they are", () => {
    expect(csvLine(["a b", "c,d"], { delimiter: "\t", quote: null })).toBe("a b\tc,d\r\n");
  });
});
