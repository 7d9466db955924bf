import { describe, expect, it } from "vitest";
import { readBytes } from "./helpers.js";

describe("TSV", () => {
  // Outside check: the IANA registration of text/tab-separated-values (example recalled from memory):
  // fields separated by tabs, one record per line, no quoting.
  it("reads the IANA registration's example", async () => {
    const read = await readBytes("Name\tAge\tAddress\nPaul\t23\t1115 W Franklin\nBessy the Cow\t5\tBig Farm Way\nZeke\t45\tW Main St\n", { format: "tsv" });
    expect(read.rows).toEqual([
      ["Name", "Age", "Address"],
      ["Paul", "23", "1115 W Franklin"],
      ["Bessy the Cow", "5", "Big Farm Way"],
      ["Zeke", "45", "W Main St"],
    ]);
    expect(read.lines).toEqual([1, 2, 3, 4]);
  });

  it("keeps quotes and commas as text, since TSV has no quoting", async () => {
    const read = await readBytes('a\tb\n"5\'11""\tx, y\n', { format: "tsv" });
    expect(read.rows[1]).toEqual(['"5\'11""', "x, y"]);
  });

  it("quotes when a quote character is declared", async () => {
    const read = await readBytes('a\tb\n"x\ty"\t2\n', { format: "tsv", quote: '"' });
    expect(read.rows[1]).toEqual(["x\ty", "2"]);
  });

  it("keeps empty trailing fields", async () => {
    const read = await readBytes("a\tb\tc\n1\t\t\n", { format: "tsv" });
    expect(read.rows[1]).toEqual(["1", "", ""]);
  });
});
