// Outside check: csv-parse (npm), read whole with its synchronous API, is the oracle for the cells of
// generated CSV and TSV files; the physical line where each record starts is known by construction.
// The reader splits quote-free lines itself and gives every record that holds a quote to csv-parse,
// so these files mix both kinds: quoted and bare fields, CR, LF and CR LF inside and between records,
// empty lines, non-ASCII text, and chunk boundaries falling anywhere (inside CR LF and characters too).
import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import { mulberry32 } from "../../src/bench/prng.js";
import { readChunked } from "./helpers.js";

interface Generated {
  readonly text: string;
  readonly rows: string[][];
  readonly lines: number[];
}

const BREAKS = ["\n", "\r\n", "\r"];
const PIECES = ["a", "b", "Z", "7", " ", "é", "漢", "\u{1F3D5}", "x y", ",", '"', "\n", "\r\n", "\r", "\t", ""];

/** A file of random records written as RFC 4180 allows, with each record's cells and starting line. */
function generate(seed: number, delimiter: string, quote: string | null): Generated {
  const rnd = mulberry32(seed);
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)] as T;
  const rows: string[][] = [];
  const lines: number[] = [];
  let text = "";
  let line = 1;
  const records = 1 + Math.floor(rnd() * 60);
  for (let r = 0; r < records; r++) {
    while (rnd() < 0.1) {
      const b = pick(BREAKS);
      // A lone CR then an LF would be one break, not an empty line.
      if (b === "\n" && text.endsWith("\r")) continue;
      text += b;
      line++;
    }
    const width = 1 + Math.floor(rnd() * 5);
    const cells: string[] = [];
    const written: string[] = [];
    for (let c = 0; c < width; c++) {
      let cell = "";
      const parts = Math.floor(rnd() * 4);
      for (let p = 0; p < parts; p++) cell += pick(PIECES);
      const special = /[\r\n"]/.test(cell) || cell.includes(delimiter);
      if (quote === null) cell = cell.replace(/[\r\n"]/g, "").split(delimiter).join("");
      const quoted = quote !== null && (special || rnd() < 0.3 || (width === 1 && cell === ""));
      if (quote === null && width === 1 && cell === "") cell = "-";
      cells.push(cell);
      written.push(quoted ? `${quote}${cell.split(quote as string).join(`${quote}${quote}`)}${quote}` : cell);
    }
    rows.push(cells);
    lines.push(line);
    for (const cell of cells) {
      const inside = cell.match(/\r\n|\r|\n/g);
      if (quote !== null && inside !== null) line += inside.length;
    }
    // A record never starts with a line break (a cell holding one is quoted), so no CR before it can pair up.
    text += written.join(delimiter);
    const last = r === records - 1 && rnd() < 0.5;
    if (!last) {
      text += pick(BREAKS);
      line++;
    }
  }
  return { text, rows, lines };
}

/** What csv-parse makes of the whole text at once, with the options the reader gives it. */
function oracle(text: string, delimiter: string, quote: string | null): string[][] {
  return parse(text, { delimiter, quote, escape: quote, relax_column_count: true, skip_empty_lines: true, record_delimiter: ["\r\n", "\n", "\r"], bom: false }) as string[][];
}

describe("the reader against csv-parse on generated files", () => {
  it("CSV: the same cells as csv-parse and the lines written, for any chunk size", async () => {
    let quotedRecords = 0;
    for (let seed = 1; seed <= 150; seed++) {
      const g = generate(seed, ",", '"');
      expect(oracle(g.text, ",", '"'), `seed ${seed}`).toEqual(g.rows);
      quotedRecords += g.text.split(/\r\n|\r|\n/).filter((l) => l.includes('"')).length;
      for (const size of [1, 3, 64, 100_000]) {
        const read = await readChunked(Buffer.from(g.text), {}, size);
        expect(read.stop, `seed ${seed} size ${size}`).toBeUndefined();
        expect(read.rows, `seed ${seed} size ${size}`).toEqual(g.rows);
        expect(read.lines, `seed ${seed} size ${size}`).toEqual(g.lines);
      }
    }
    // Both paths ran: lines without quotes (split here) and with them (csv-parse).
    expect(quotedRecords).toBeGreaterThan(500);
  });

  it("a multi-character delimiter and a single quote as the quote character", async () => {
    for (let seed = 200; seed <= 240; seed++) {
      const g = generate(seed, "||", "'");
      expect(oracle(g.text, "||", "'"), `seed ${seed}`).toEqual(g.rows);
      for (const size of [2, 4096]) {
        const read = await readChunked(Buffer.from(g.text), { delimiter: "||", quote: "'" }, size);
        expect(read.rows, `seed ${seed} size ${size}`).toEqual(g.rows);
        expect(read.lines, `seed ${seed} size ${size}`).toEqual(g.lines);
      }
    }
  });

  it("TSV without quoting: every line is split at tabs", async () => {
    for (let seed = 300; seed <= 330; seed++) {
      const g = generate(seed, "\t", null);
      expect(oracle(g.text, "\t", null), `seed ${seed}`).toEqual(g.rows);
      const read = await readChunked(Buffer.from(g.text), { format: "tsv" }, 5);
      expect(read.rows, `seed ${seed}`).toEqual(g.rows);
      expect(read.lines, `seed ${seed}`).toEqual(g.lines);
    }
  });

  it("a malformed record stops reading at its line, after every record before it, as csv-parse refuses it", async () => {
    for (let seed = 400; seed <= 460; seed++) {
      const g = generate(seed, ",", '"');
      const rnd = mulberry32(seed);
      const bad = Math.floor(rnd() * g.rows.length);
      // The physical line where record `bad` starts becomes a broken record: a quote inside a bare
      // field (RFC 4180 section 2 rule 5), or text after a closing quote.
      const broken = rnd() < 0.5 ? 'ab"c,d' : '"ab"c,d';
      const parts = g.text.split(/(\r\n|\r|\n)/);
      const at = g.lines[bad] as number;
      parts[2 * (at - 1)] = broken;
      const text = parts.join("");
      expect(() => oracle(text, ",", '"'), `seed ${seed}`).toThrow();
      for (const size of [7, 100_000]) {
        const read = await readChunked(Buffer.from(text), {}, size);
        expect(read.rows, `seed ${seed} size ${size}`).toEqual(g.rows.slice(0, bad));
        expect(read.lines, `seed ${seed} size ${size}`).toEqual(g.lines.slice(0, bad));
        expect(read.stop?.line, `seed ${seed} size ${size}`).toBe(at);
      }
    }
  });

  it("records of megabytes, quoted across many lines or bare on one, are read whole and lines stay right", async () => {
    const longQuoted = `${"x,\r\n".repeat(700_000)}"" end`;
    const longBare = "y".repeat(3_000_000);
    const text = `id,note\n1,"${longQuoted.replace(/"/g, '""')}"\n2,${longBare}\r\n3,"a\nb"\n4,z`;
    const expected = [["id", "note"], ["1", longQuoted], ["2", longBare], ["3", "a\nb"], ["4", "z"]];
    expect(oracle(text, ",", '"')).toEqual(expected);
    for (const size of [65_536, 1_000_003]) {
      const read = await readChunked(Buffer.from(text), {}, size);
      expect(read.stop).toBeUndefined();
      expect(read.rows.length).toBe(expected.length);
      expect(read.rows.every((r, i) => r.join("|") === expected[i]?.join("|"))).toBe(true);
      expect(read.lines).toEqual([1, 2, 700_003, 700_004, 700_006]);
    }
  });
});
