// Outside check: RFC 4180 (Common Format and MIME Type for CSV Files), section 2, rules 1-7, using the
// RFC's own examples where it gives them. Line numbers are physical lines counted by hand.
import { describe, expect, it } from "vitest";
import { readBytes, readChunked } from "./helpers.js";

describe("RFC 4180 section 2", () => {
  it("rule 1: records on separate lines, delimited by CRLF", async () => {
    const read = await readBytes("aaa,bbb,ccc\r\nzzz,yyy,xxx\r\n");
    expect(read.rows).toEqual([["aaa", "bbb", "ccc"], ["zzz", "yyy", "xxx"]]);
    expect(read.lines).toEqual([1, 2]);
  });

  it("rule 2: the last record may lack a line break", async () => {
    const read = await readBytes("aaa,bbb,ccc\r\nzzz,yyy,xxx");
    expect(read.rows).toEqual([["aaa", "bbb", "ccc"], ["zzz", "yyy", "xxx"]]);
    expect(read.stop).toBeUndefined();
  });

  it("rule 3: a header line is yielded as the first record", async () => {
    const read = await readBytes("field_name,field_name,field_name\r\naaa,bbb,ccc\r\nzzz,yyy,xxx\r\n");
    expect(read.rows[0]).toEqual(["field_name", "field_name", "field_name"]);
    expect(read.rows).toHaveLength(3);
  });

  it("rule 4: spaces are part of a field and are kept", async () => {
    const read = await readBytes("a,b\r\n  x , y\r\n");
    expect(read.rows[1]).toEqual(["  x ", " y"]);
  });

  it("rule 4: a record with a different field count is delivered as it is", async () => {
    const read = await readBytes("a,b,c\r\n1,2\r\n1,2,3,4\r\n");
    expect(read.rows.map((r) => r.length)).toEqual([3, 2, 4]);
  });

  it("rule 5: fields may be enclosed in double quotes", async () => {
    const read = await readBytes('"aaa","bbb","ccc"\r\nzzz,yyy,xxx');
    expect(read.rows).toEqual([["aaa", "bbb", "ccc"], ["zzz", "yyy", "xxx"]]);
  });

  it("rule 6: quoted fields hold CRLF, quotes and commas; the next record starts on the right line", async () => {
    const read = await readBytes('"aaa","b\r\nbb","ccc"\r\nzzz,yyy,xxx\r\n');
    expect(read.rows).toEqual([["aaa", "b\r\nbb", "ccc"], ["zzz", "yyy", "xxx"]]);
    expect(read.lines).toEqual([1, 3]);
  });

  it("rule 7: a doubled quote inside a quoted field is one quote", async () => {
    const read = await readBytes('"aaa","b""bb","ccc"');
    expect(read.rows).toEqual([["aaa", 'b"bb', "ccc"]]);
  });
});

describe("physical lines", () => {
  it("count every line of multi-line records, with LF, CRLF and CR endings alike", async () => {
    for (const nl of ["\n", "\r\n", "\r"]) {
      const text = ["h1,h2", '1,"two', "lines", 'three"', "2,x", '3,"a', 'b"', "4,y"].join(nl) + nl;
      const read = await readBytes(text);
      expect(read.lines, JSON.stringify(nl)).toEqual([1, 2, 5, 6, 8]);
      expect(read.rows[1]).toEqual(["1", `two${nl}lines${nl}three`]);
    }
  });

  it("skip empty lines but count them", async () => {
    const read = await readBytes("a,b\n\n1,2\r\n\r\n\n3,4\n\n");
    expect(read.rows).toEqual([["a", "b"], ["1", "2"], ["3", "4"]]);
    expect(read.lines).toEqual([1, 3, 6]);
  });

  it("keep a quoted empty field on its own line as a record", async () => {
    const read = await readBytes('a\n""\nb\n');
    expect(read.rows).toEqual([["a"], [""], ["b"]]);
    expect(read.lines).toEqual([1, 2, 3]);
  });

  it("treat mixed line endings each as one break, leaving no CR in a cell", async () => {
    const read = await readBytes("a,b\n1,2\r\n3,4\r5,6\n");
    expect(read.rows).toEqual([["a", "b"], ["1", "2"], ["3", "4"], ["5", "6"]]);
    expect(read.lines).toEqual([1, 2, 3, 4]);
  });

  it("read an empty file as no records", async () => {
    const read = await readBytes("");
    expect(read.rows).toEqual([]);
    expect(read.stop).toBeUndefined();
  });
});

describe("chunk boundaries", () => {
  const texts = [
    'id,note\r\n1,"a\r\nb"\r\n2,"say ""hi"""\r\n\r\n3,"x,y"\r\n4,end',
    "id,note\n1,caf\u00e9\n2,\u20ac \ud83d\ude00\n3,\"multi\nline\"\n",
    "a,b\r1,\"2\r\n3\"\r\r4,5",
  ];
  it.each(texts.map((t, i) => [i, t] as const))("text %i reads the same in 1, 2, 3 and 7 byte chunks as whole", async (_i, text) => {
    const whole = await readBytes(text);
    for (const size of [1, 2, 3, 7]) {
      const chunked = await readChunked(Buffer.from(text), {}, size);
      expect(chunked.rows, `size ${size}`).toEqual(whole.rows);
      expect(chunked.lines, `size ${size}`).toEqual(whole.lines);
      expect(chunked.stop).toBeUndefined();
    }
  });
});

describe("dialect", () => {
  it("uses a declared delimiter and quote", async () => {
    const read = await readBytes("a;b\n'x;y';2\n", { delimiter: ";", quote: "'" });
    expect(read.rows).toEqual([["a", "b"], ["x;y", "2"]]);
  });
});
