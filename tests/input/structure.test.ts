// SPEC section 3: a delivery that cannot be read to its end stops at the line where reading stopped,
// and everything read before it is still delivered.
import { mkdirSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { openDelivery } from "../../src/input/index.js";
import { MAX_CELLS, MAX_RECORD_SIZE } from "../../src/input/types.js";
import { CSV, readBytes, readChunked, tempFile } from "./helpers.js";

describe("structure breaks", () => {
  it("an unterminated quote stops at the line where its record starts, after all earlier records", async () => {
    const text = "id,note\n1,a\n2,\"b\nc\"\n3,\"never closed\n4,x\n5,y\n";
    const read = await readBytes(text);
    expect(read.rows).toEqual([["id", "note"], ["1", "a"], ["2", "b\nc"]]);
    expect(read.stop?.line).toBe(5);
    for (const size of [1, 4]) {
      const chunked = await readChunked(Buffer.from(text), {}, size);
      expect(chunked.rows).toEqual(read.rows);
      expect(chunked.stop?.line).toBe(5);
    }
  });

  it("a quote that never closes stops at MAX_RECORD_SIZE instead of holding the rest of the file", async () => {
    const text = `id,note\n1,a\n2,"never closed\n${"x,y\n".repeat(MAX_RECORD_SIZE / 4 + 10)}`;
    const read = await readBytes(text);
    expect(read.rows).toEqual([["id", "note"], ["1", "a"]]);
    expect(read.stop?.line).toBe(3);
  });

  it("a record of more than MAX_CELLS cells stops at its line; nothing after it is read", async () => {
    const text = `a,b\n1,2\n${",".repeat(MAX_CELLS)}\n3,4\n`;
    const read = await readBytes(text);
    expect(read.rows).toEqual([["a", "b"], ["1", "2"]]);
    expect(read.stop?.line).toBe(3);
  });

  it("an NDJSON line longer than MAX_RECORD_SIZE stops at that line", async () => {
    const text = `{"a":1}\n{"a":"${"x".repeat(MAX_RECORD_SIZE + 10)}"}\n{"a":3}\n`;
    const read = await readBytes(text, { format: "ndjson" }, ".ndjson");
    expect(read.rows).toEqual([["a"], ["1"]]);
    expect(read.stop?.line).toBe(2);
  });

  it("an unterminated quote after skipped empty lines counts them", async () => {
    const read = await readBytes('a\n\n\n"b\n');
    expect(read.rows).toEqual([["a"]]);
    expect(read.stop?.line).toBe(4);
  });

  it("text after a closing quote stops at that record, naming the field", async () => {
    const read = await readBytes('a,b,c\n1,2,3\n4,"5"x,6\n7,8,9\n');
    expect(read.rows).toEqual([["a", "b", "c"], ["1", "2", "3"]]);
    expect(read.stop).toMatchObject({ line: 3, column: 2 });
    // The field is named in the words of the finding too, where a reader of the report sees it.
    expect(read.stop?.message).toContain("field 2");
  });

  it("a quote inside an unquoted field stops reading (RFC 4180 section 2 rule 5)", async () => {
    const read = await readBytes('a,b\n1,5"11\n2,3\n');
    expect(read.rows).toEqual([["a", "b"]]);
    expect(read.stop).toMatchObject({ line: 2, column: 2 });
  });

  it("many records before a break all arrive across several read chunks", async () => {
    const body = Array.from({ length: 30000 }, (_, i) => `${i},"row ${i}"`).join("\n");
    const read = await readBytes(`n,text\n${body}\n30000,"open\n`);
    expect(read.rows).toHaveLength(30001);
    expect(read.rows[30000]).toEqual(["29999", "row 29999"]);
    expect(read.stop?.line).toBe(30002);
  });
});

describe("opening", () => {
  it("a missing file is a problem naming the file", async () => {
    const path = `${tempFile("x")}.missing`;
    const opened = await openDelivery(path, CSV);
    expect(opened.ok).toBe(false);
    if (!opened.ok) expect(opened.problems[0]?.file).toBe(path);
  });

  it("a folder is a problem naming it", async () => {
    const path = `${tempFile("x")}.d`;
    mkdirSync(path);
    const opened = await openDelivery(path, CSV);
    expect(opened.ok).toBe(false);
    if (!opened.ok) expect(opened.problems[0]?.file).toBe(path);
  });

  it("a dialect csv-parse refuses (delimiter equal to quote) is a problem naming the file", async () => {
    const path = tempFile("a,b\n");
    const opened = await openDelivery(path, { ...CSV, delimiter: '"' });
    expect(opened.ok).toBe(false);
    if (!opened.ok) expect(opened.problems[0]?.file).toBe(path);
  });

  // Outside check: FIPS 180-2, appendix B.1: SHA-256("abc").
  it("summary gives the size and SHA-256 of the file", async () => {
    const read = await readBytes("abc");
    expect(read.summary).toEqual({ encoding: "utf-8", bytes: 3, sha256: "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad" });
  });

  it("summary hashes the whole file even when reading stopped early", async () => {
    const read = await readBytes('"abc');
    expect(read.stop?.line).toBe(1);
    expect(read.summary.bytes).toBe(4);
    // SHA-256 of the 4 bytes `"abc`, computed with sha256sum (GNU coreutils).
    expect(read.summary.sha256).toBe("aa885fb27a812abedb8978a3bb3218cbb01a22d270469b74f23995140175c462");
  });

  it("invalid bytes stop at their own physical line, counting CR LF, lone CR and empty lines once each", async () => {
    const bytes = Buffer.concat([Buffer.from('a,b\r\n\r\n"x\r\ny",z\rc,'), Buffer.from([0xff]), Buffer.from("d\n")]);
    for (const size of [1, 3, 4096]) {
      const read = await readChunked(bytes, {}, size);
      expect(read.rows).toEqual([["a", "b"], ["x\r\ny", "z"]]);
      // Line 1 a,b; line 2 empty; lines 3-4 the quoted record; line 5 holds the bad byte.
      expect(read.stop?.line).toBe(5);
      expect(read.stop?.message).toContain("not valid UTF-8");
    }
  });

  it("a quoting mistake before invalid bytes is the one reported; an open quote cut short by them is not a mistake", async () => {
    const mistake = Buffer.concat([Buffer.from('a,b\nbb"x,'), Buffer.from([0xff])]);
    const open = Buffer.concat([Buffer.from('a,b\n"q'), Buffer.from([0xff]), Buffer.from('"\n')]);
    const closed = Buffer.concat([Buffer.from('a,b\n"q"'), Buffer.from([0xf0, 0xff])]);
    for (const size of [1, 4096]) {
      const m = await readChunked(mistake, {}, size);
      expect(m.stop).toMatchObject({ line: 2, column: 1 });
      const o = await readChunked(open, {}, size);
      expect(o.stop?.line).toBe(2);
      expect(o.stop?.message).toContain("not valid UTF-8");
      const c = await readChunked(closed, {}, size);
      expect(c.stop?.message).toContain("not valid UTF-8");
    }
  });
});
