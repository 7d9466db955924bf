import { describe, expect, it } from "vitest";
import { readBytes, readChunked } from "./helpers.js";

const NDJSON = { format: "ndjson" } as const;

describe("NDJSON", () => {
  it("yields the first object's keys as a header record, then values in that order", async () => {
    const read = await readBytes('{"sku":"TNT-2","qty":3,"price":129.5,"gift":false}\n{"qty":1,"sku":"STV-1","price":49,"gift":true}\n', NDJSON, ".ndjson");
    expect(read.rows).toEqual([
      ["sku", "qty", "price", "gift"],
      ["TNT-2", "3", "129.5", "false"],
      ["STV-1", "1", "49", "true"],
    ]);
    expect(read.lines).toEqual([1, 1, 2]);
  });

  it("gives '' for a missing key or null, JSON text for nested values, extra keys appended", async () => {
    const read = await readBytes('{"a":"x","b":"y"}\n{"a":null}\n{"b":"z","a":"w","c":[1,{"d":2}]}\n', NDJSON, ".ndjson");
    expect(read.rows).toEqual([
      ["a", "b"],
      ["x", "y"],
      ["", ""],
      ["w", "z", '[1,{"d":2}]'],
    ]);
  });

  it("skips blank lines but counts them, accepts CRLF and a missing final newline", async () => {
    const read = await readBytes('{"a":1}\r\n\r\n{"a":2}\r\n\n{"a":3}', NDJSON, ".ndjson");
    expect(read.rows).toEqual([["a"], ["1"], ["2"], ["3"]]);
    expect(read.lines).toEqual([1, 1, 3, 5]);
  });

  it("stops at a line that is not JSON, after the lines before it", async () => {
    const read = await readBytes('{"a":1}\n{"a":2}\n{"a":\n{"a":4}\n', NDJSON, ".ndjson");
    expect(read.rows).toEqual([["a"], ["1"], ["2"]]);
    expect(read.stop?.line).toBe(3);
  });

  it.each([["[1,2]"], ["42"], ["null"], ['"text"']])("stops at a line holding %s, which is not an object", async (line) => {
    const read = await readBytes(`{"a":1}\n${line}\n`, NDJSON, ".ndjson");
    expect(read.rows).toEqual([["a"], ["1"]]);
    expect(read.stop?.line).toBe(2);
  });

  it("reads multi-byte text split across chunks, and stops at invalid UTF-8", async () => {
    const text = Buffer.from('{"city":"Z\u00fcrich \u20ac"}\n{"city":"\ud83c\udfd4"}\n');
    expect((await readChunked(text, NDJSON, 1)).rows).toEqual([["city"], ["Z\u00fcrich \u20ac"], ["\ud83c\udfd4"]]);
    const bad = Buffer.concat([Buffer.from('{"c":"a"}\n{"c":"'), Buffer.from([0xff]), Buffer.from('"}\n')]);
    const read = await readBytes(bad, NDJSON, ".ndjson");
    expect(read.rows).toEqual([["c"], ["a"]]);
    expect(read.stop?.line).toBe(2);
  });

  // Outside check: the JSON Lines documentation (jsonlines.org) example, recalled from memory.
  it("reads the JSON Lines example", async () => {
    const read = await readBytes(
      '{"name": "Gilbert", "wins": [["straight", "7\u2663"], ["one pair", "10\u2665"]]}\n{"name": "Alexa", "wins": [["two pair", "4\u2660"], ["two pair", "9\u2660"]]}\n{"name": "May", "wins": []}\n{"name": "Deloise", "wins": [["three of a kind", "5\u2663"]]}\n',
      NDJSON,
      ".jsonl",
    );
    expect(read.rows.map((r) => r[0])).toEqual(["name", "Gilbert", "Alexa", "May", "Deloise"]);
    expect(read.rows[3]).toEqual(["May", "[]"]);
  });
});
