/**
 * NDJSON numbers keep the digits the file wrote. RFC 8259 section 6 leaves number precision to the
 * reader; a JSON.parse double would turn 9007199254740993 into 9007199254740992 and 2.50 into 2.5.
 */
import { describe, expect, it } from "vitest";
import { memberSources } from "../../src/input/json-members.js";
import { checkJson } from "../helpers/cli.js";
import { readBytes } from "./helpers.js";

describe("NDJSON numbers", () => {
  it("cells hold numbers as written", async () => {
    const read = await readBytes('{"id": 9007199254740993, "price": 2.50, "n": -0, "e": 1E2, "s": "2.50"}\n', { format: "ndjson", encoding: "utf-8" }, ".ndjson");
    expect(read.rows[1]).toEqual(["9007199254740993", "2.50", "-0", "1E2", "2.50"]);
  });

  it("big integers that share a double are different keys, and bounds judge their digits", async () => {
    const contract = "tablegate: 1\nname: meters\ninput: { format: ndjson }\ncolumns:\n  meter_id: { type: integer, max: 9007199254740992 }\nkeys: [meter_id]\n";
    const { report } = await checkJson(contract, '{"meter_id": 9007199254740992}\n{"meter_id": 9007199254740993}\n{"meter_id": 09007199254740992}\n', [], "data.ndjson");
    const rows = (rule: string) => report.findings.filter((f) => f.rule === rule).map((f) => f.row);
    // 09007199254740992 is not JSON (leading zero), so reading stops at line 3.
    expect({ key: rows("key:meter_id"), max: rows("meter_id.max"), structure: rows("file.structure").length }).toEqual({ key: [], max: [2], structure: 1 });
  });

  it("finds each member's source text, whatever strings, nesting and spaces surround it", () => {
    const m = memberSources('{ "a" : 1.50 , "b\\"c": {"x": [1, "}", 2]}, "d": "q,}", "a": 7 }');
    expect([...m]).toEqual([["a", "7"], ['b"c', '{"x": [1, "}", 2]}'], ["d", '"q,}"']]);
  });
});
