import { describe, expect, it } from "vitest";
import { firstInvalid } from "../../src/input/utf8.js";
import { readBytes, readChunked } from "./helpers.js";

const bytes = (...parts: (string | number[])[]): Buffer =>
  Buffer.concat(parts.map((p) => (typeof p === "string" ? Buffer.from(p, "latin1") : Buffer.from(p))));

// RFC 2781 section 3.2: U+FEFF as FF FE marks little-endian, FE FF big-endian.
const utf16le = (s: string): Buffer => Buffer.from(s, "utf16le");
const utf16be = (s: string): Buffer => Buffer.from(s, "utf16le").swap16();

describe("UTF-8", () => {
  // Unicode Standard, section 23.8: U+FEFF at the start of a UTF-8 file is a byte order mark (EF BB BF).
  it("drops a byte order mark", async () => {
    const data = bytes([0xef, 0xbb, 0xbf], "id,name\n1,x\n");
    const read = await readBytes(data);
    expect(read.rows[0]).toEqual(["id", "name"]);
    expect(read.summary.encoding).toBe("utf-8");
    for (const size of [1, 2]) expect((await readChunked(data, {}, size)).rows[0]).toEqual(["id", "name"]);
    expect((await readBytes(bytes([0xef, 0xbb, 0xbf]))).rows).toEqual([]);
  });

  it("reads multi-byte characters, whole and split across every chunk boundary", async () => {
    const text = Buffer.from("name\ncaf\u00e9\n\u20ac5\n\ud83c\udfd4\ufe0f\n", "utf8");
    expect((await readBytes(text)).rows).toEqual([["name"], ["caf\u00e9"], ["\u20ac5"], ["\ud83c\udfd4\ufe0f"]]);
    expect((await readChunked(text, {}, 1)).rows).toEqual([["name"], ["caf\u00e9"], ["\u20ac5"], ["\ud83c\udfd4\ufe0f"]]);
  });

  it("stops at the line holding an invalid byte, after the records before it", async () => {
    const text = bytes("id,note\n1,\"two\nlines\"\n2,ok\n3,caf", [0xe9], "\n4,after\n");
    const read = await readBytes(text);
    expect(read.rows).toEqual([["id", "note"], ["1", "two\nlines"], ["2", "ok"]]);
    expect(read.stop?.line).toBe(5);
    for (const size of [1, 2, 5]) {
      const chunked = await readChunked(text, {}, size);
      expect(chunked.rows, `size ${size}`).toEqual(read.rows);
      expect(chunked.stop?.line, `size ${size}`).toBe(5);
    }
  });

  it("places an invalid byte inside a multi-line quoted field on its own line", async () => {
    const read = await readBytes(bytes('a\r\n"x\r\ny\r\n', [0xff], 'z"\r\n'));
    expect(read.rows).toEqual([["a"]]);
    expect(read.stop?.line).toBe(4);
  });

  it("stops when the file ends inside a character", async () => {
    const read = await readBytes(bytes("a\n1\n2", [0xe2, 0x82]));
    expect(read.rows).toEqual([["a"], ["1"]]);
    expect(read.stop?.line).toBe(3);
  });

  // Unicode Standard, Table 3-7 (well-formed UTF-8 byte sequences) and RFC 3629 section 3.
  it.each([
    ["overlong two-byte form of '/'", [0xc0, 0xaf]],
    ["overlong three-byte form", [0xe0, 0x80, 0xaf]],
    ["encoded surrogate U+D800", [0xed, 0xa0, 0x80]],
    ["code point above U+10FFFF", [0xf4, 0x90, 0x80, 0x80]],
    ["lone continuation byte", [0x80]],
    ["truncated sequence before ASCII", [0xe2, 0x82, 0x41]],
  ])("rejects %s", async (_what, seq) => {
    const read = await readBytes(bytes("a\nok\n", seq, "\n"));
    expect(read.rows).toEqual([["a"], ["ok"]]);
    expect(read.stop?.line).toBe(3);
  });

  // Outside check: Node's WHATWG TextDecoder with fatal: true, on seeded random bytes. Our first invalid
  // offset o must leave a prefix that decodes, and no longer prefix (up to 4 bytes more) may decode.
  it("finds the same first invalid byte as a fatal TextDecoder", () => {
    const decoder = new TextDecoder("utf-8", { fatal: true });
    const decodes = (b: Buffer): boolean => {
      try {
        decoder.decode(b);
        return true;
      } catch {
        return false;
      }
    };
    let seed = 20260115;
    const random = (): number => {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      return seed / 2147483648;
    };
    const pool = [0x41, 0x0a, 0x80, 0x8f, 0x9f, 0xa0, 0xbf, 0xc2, 0xdf, 0xe0, 0xed, 0xef, 0xf0, 0xf4, 0xf5, 0xff];
    let invalidSeen = 0;
    for (let n = 0; n < 3000; n++) {
      const buf = Buffer.from(Array.from({ length: 1 + Math.floor(random() * 8) }, () => pool[Math.floor(random() * pool.length)]!));
      const o = firstInvalid(buf, 0, buf.length);
      if (o < 0) {
        expect(decodes(buf)).toBe(true);
        continue;
      }
      invalidSeen++;
      expect(decodes(buf.subarray(0, o))).toBe(true);
      for (let e = o + 1; e <= Math.min(buf.length, o + 4); e++) expect(decodes(buf.subarray(0, e))).toBe(false);
    }
    expect(invalidSeen).toBeGreaterThan(1000);
  });
});

describe("UTF-16", () => {
  const text = "id,name\n1,Z\u00fcrich \u20ac\n2,\ud83c\udfd4\n";
  const rows = [["id", "name"], ["1", "Z\u00fcrich \u20ac"], ["2", "\ud83c\udfd4"]];

  it.each([
    ["utf-16le", "with", Buffer.concat([Buffer.from([0xff, 0xfe]), utf16le(text)])],
    ["utf-16le", "without", utf16le(text)],
    ["utf-16be", "with", Buffer.concat([Buffer.from([0xfe, 0xff]), utf16be(text)])],
    ["utf-16be", "without", utf16be(text)],
  ] as const)("%s %s a byte order mark", async (encoding, _bom, data) => {
    const read = await readBytes(data, { encoding });
    expect(read.rows).toEqual(rows);
    expect(read.lines).toEqual([1, 2, 3]);
    expect(read.summary.encoding).toBe(encoding);
    for (const size of [1, 3]) expect((await readChunked(data, { encoding }, size)).rows).toEqual(rows);
  });

  it("stops at an unpaired surrogate, at its line", async () => {
    const data = Buffer.concat([utf16le("a\n1\n2,"), Buffer.from([0x00, 0xd8]), utf16le("x\n3\n")]);
    const read = await readBytes(data, { encoding: "utf-16le" });
    expect(read.rows).toEqual([["a"], ["1"]]);
    expect(read.stop?.line).toBe(3);
  });

  it("stops when the file has an odd number of bytes", async () => {
    const read = await readBytes(Buffer.concat([utf16le("a\n1\n"), Buffer.from([0x41])]), { encoding: "utf-16le" });
    expect(read.rows).toEqual([["a"], ["1"]]);
    expect(read.stop?.line).toBe(3);
  });
});

describe("single-byte encodings", () => {
  // WHATWG Encoding Standard, index-windows-1252: 0x80 is U+20AC (euro sign), 0xE9 is U+00E9.
  it("windows-1252: 0x80 is the euro sign, 0xE9 is é", async () => {
    const read = await readBytes(bytes("price,city\n", [0x80], "5,Bogot", [0xe9], "\n"), { encoding: "windows-1252" });
    expect(read.rows).toEqual([["price", "city"], ["\u20ac5", "Bogot\u00e9"]]);
    expect(read.summary.encoding).toBe("windows-1252");
  });

  // WHATWG Encoding Standard, index-windows-1252 (also Microsoft's CP1252 table for the defined bytes;
  // cross-checked when written with Python's cp1252 codec): 0x8A Š, 0x99 ™, 0x9F Ÿ, 0x93/0x94 curly
  // quotes; 0x81 is undefined by Microsoft and maps to U+0081 in WHATWG.
  it("windows-1252: the 0x80-0x9F block follows index-windows-1252", async () => {
    const read = await readBytes(bytes("a\n", [0x8a, 0x99, 0x9f, 0x93, 0x94, 0x81], "\n"), { encoding: "windows-1252" });
    expect(read.rows[1]).toEqual(["\u0160\u2122\u0178\u201c\u201d\u0081"]);
  });

  // ISO/IEC 8859-1: each byte is the code point of the same number, so 0x80 is the control U+0080.
  it("latin1 is ISO-8859-1 proper: 0xE9 is é and 0x80 is U+0080", async () => {
    const read = await readBytes(bytes("a\n", [0x80], "x", [0xe9], "\n"), { encoding: "latin1" });
    expect(read.rows).toEqual([["a"], ["\u0080x\u00e9"]]);
  });

  it("a UTF-8 byte order mark is text in a single-byte encoding", async () => {
    const read = await readBytes(bytes([0xef, 0xbb, 0xbf], "a\n"), { encoding: "windows-1252" });
    expect(read.rows).toEqual([["\u00ef\u00bb\u00bfa"]]);
  });
});

describe("auto", () => {
  it.each([
    ["utf-8", bytes([0xef, 0xbb, 0xbf], "a\n", [0xc3, 0xa9], "\n")],
    ["utf-16le", Buffer.concat([Buffer.from([0xff, 0xfe]), utf16le("a\n\u00e9\n")])],
    ["utf-16be", Buffer.concat([Buffer.from([0xfe, 0xff]), utf16be("a\n\u00e9\n")])],
  ] as const)("follows a byte order mark to %s", async (encoding, data) => {
    const read = await readBytes(data, { encoding: "auto" });
    expect(read.rows).toEqual([["a"], ["\u00e9"]]);
    expect(read.summary.encoding).toBe(encoding);
    expect(read.summary.note).toBeUndefined();
  });

  it("reads valid UTF-8 without a byte order mark as UTF-8", async () => {
    const data = bytes("a\n", [0xc3, 0xa9], "\n");
    for (const size of [1, 2, 100]) expect((await readChunked(data, { encoding: "auto" }, size)).rows).toEqual([["a"], ["\u00e9"]]);
    const read = await readBytes(data, { encoding: "auto" });
    expect(read.summary).toMatchObject({ encoding: "utf-8" });
    expect(read.summary.note).toBeUndefined();
  });

  it("falls back to windows-1252 with a note when bytes are not UTF-8", async () => {
    const data = bytes("a\nok\n", [0x80], "5 caf", [0xe9], "\n");
    const read = await readBytes(data, { encoding: "auto" });
    expect(read.rows).toEqual([["a"], ["ok"], ["\u20ac5 caf\u00e9"]]);
    expect(read.summary.encoding).toBe("windows-1252");
    expect(read.summary.note).toBeDefined();
    for (const size of [1, 2, 7]) expect((await readChunked(data, { encoding: "auto" }, size)).rows).toEqual(read.rows);
  });

  it("falls back to windows-1252 when the file ends on a lone lead byte", async () => {
    const read = await readBytes(bytes("a\nx", [0xe9]), { encoding: "auto" });
    expect(read.rows).toEqual([["a"], ["x\u00e9"]]);
    expect(read.summary.encoding).toBe("windows-1252");
  });

  it("decides late: ASCII first, windows-1252 bytes far down the file", async () => {
    const data = bytes("n\n", "x\n".repeat(200000), "caf", [0xe9], "\n");
    const read = await readBytes(data, { encoding: "auto" });
    expect(read.rows).toHaveLength(200002);
    expect(read.rows[200001]).toEqual(["caf\u00e9"]);
    expect(read.summary.encoding).toBe("windows-1252");
  });

  it("stops at invalid bytes after text that was valid UTF-8", async () => {
    const read = await readBytes(bytes("a\n", [0xc3, 0xa9], "\nb\n", [0xe9], "\n"), { encoding: "auto" });
    expect(read.rows).toEqual([["a"], ["\u00e9"], ["b"]]);
    expect(read.stop?.line).toBe(4);
    expect(read.summary.encoding).toBe("utf-8");
  });
});
