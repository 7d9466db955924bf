import { createHash } from "node:crypto";
import { gzipSync } from "node:zlib";
import { describe, expect, it } from "vitest";
import { readBytes } from "./helpers.js";

describe("gzip by file suffix", () => {
  const text = "id,note\n1,\"tent,\n2-person\"\n2,stove\n";

  it("reads a .gz file decompressed, and sums the compressed bytes", async () => {
    const gz = gzipSync(Buffer.from(text));
    const read = await readBytes(gz, {}, ".csv.gz");
    expect(read.rows).toEqual([["id", "note"], ["1", "tent,\n2-person"], ["2", "stove"]]);
    expect(read.lines).toEqual([1, 2, 4]);
    // Outside check: Node's crypto SHA-256 of the file as written.
    expect(read.summary).toMatchObject({ bytes: gz.length, sha256: createHash("sha256").update(gz).digest("hex") });
  });

  it("reads a file without the suffix as it is, even if compressed", async () => {
    const read = await readBytes("a\n1\n", {}, ".csv");
    expect(read.rows).toEqual([["a"], ["1"]]);
  });

  it("stops at the line reached when the compressed data is cut short, after the records before it", async () => {
    const rows = Array.from({ length: 50000 }, (_, i) => `${i},item ${i}`).join("\n");
    const gz = gzipSync(Buffer.from(`n,text\n${rows}\n`));
    const cut = gz.subarray(0, Math.floor(gz.length * 0.6));
    const read = await readBytes(cut, {}, ".csv.gz");
    expect(read.stop).toBeDefined();
    expect(read.rows.length).toBeGreaterThan(1000);
    expect(read.rows.length).toBeLessThan(50001);
    // Every delivered record is whole and in order.
    read.rows.slice(1).forEach((r, i) => expect(r).toEqual([String(i), `item ${i}`]));
    expect(read.stop!.line).toBeGreaterThanOrEqual(read.lines[read.lines.length - 1]! + 1);
    expect(read.summary).toMatchObject({ bytes: cut.length, sha256: createHash("sha256").update(cut).digest("hex") });
  });

  it("stops at line 1 when the file is not gzip at all", async () => {
    const read = await readBytes("plain,text\n1,2\n", {}, ".csv.gz");
    expect(read.rows).toEqual([]);
    expect(read.stop?.line).toBe(1);
  });

  it("a bad CRC in the gzip trailer stops reading at the end, losing at most the last 16 KiB inflated", async () => {
    // RFC 1952 section 2.3.1: the member ends with CRC32 then ISIZE; flipping the CRC leaves the data whole.
    const body = `n,text\n${Array.from({ length: 20000 }, (_, i) => `${i},item ${i}`).join("\n")}\n`;
    const gz = Buffer.from(gzipSync(Buffer.from(body)));
    gz[gz.length - 8] = (gz[gz.length - 8] ?? 0) ^ 0xff;
    const read = await readBytes(gz, {}, ".csv.gz");
    expect(read.stop).toBeDefined();
    // Every record that ends before the last 16 KiB of the text is read.
    const safe = body.slice(0, body.length - 16 * 1024).split("\n").length - 1;
    expect(read.rows.length).toBeGreaterThanOrEqual(safe);
    expect(read.rows.length).toBeLessThanOrEqual(20001);
  });
});
