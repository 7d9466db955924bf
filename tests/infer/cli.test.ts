/** `tablegate infer` on the command line: arguments, exit statuses, formats, encodings, the draft's head. */
import { existsSync } from "node:fs";
import { isAbsolute, join } from "node:path";
import { fileURLToPath } from "node:url";
import { gzipSync } from "node:zlib";
import { describe, expect, it } from "vitest";
import { nameFromFile } from "../../src/infer/index.js";
import { runCli, type CliRun } from "../helpers/cli.js";
import { tablegate } from "../registry/helpers.js";
import { column, inferFile, roundTrip } from "./helpers.js";

const lines = (r: CliRun) => r.stderr.split("\n").filter((l) => l.trim() !== "");
const clean = "sku,qty\nTENT-2041,1\nMAP-0001,2\n";

describe("exit 2, one line on stderr naming the file", () => {
  it.each([
    ["a missing file", ["infer", "missing.csv"], {}, "missing.csv"],
    ["a name with no known suffix", ["infer", "d.txt"], { "d.txt": clean }, "d.txt"],
    ["an unterminated quote (file:line)", ["infer", "d.csv"], { "d.csv": 'sku,qty\nTENT,1\n"MAP,2\n' }, "d.csv:3"],
    ["an empty file", ["infer", "d.csv"], { "d.csv": "" }, "d.csv"],
    ["a header naming a column twice (file:line:col)", ["infer", "d.csv"], { "d.csv": "sku,qty,sku\nA,1,B\n" }, "d.csv:1:3"],
    ["bytes that are not UTF-8 after UTF-8 text", ["infer", "d.ndjson"], { "d.ndjson": Buffer.concat([Buffer.from('{"a":"é"}\n{"a":"'), Buffer.from([0xe9]), Buffer.from('"}\n')]) }, "d.ndjson:2"],
  ])("%s", async (_what, argv, files, named) => {
    const r = await runCli(argv, files);
    expect({ code: r.code, stdout: r.stdout, lines: lines(r).length }).toEqual({ code: 2, stdout: "", lines: 1 });
    expect(r.stderr).toContain(named);
  });

  it("no file, two files, an unknown flag, a --name outside [a-z0-9-]", async () => {
    for (const argv of [["infer"], ["infer", "a.csv", "b.csv"], ["infer", "a.csv", "--bogus"], ["infer", "a.csv", "--name", "Weekly Sales"]]) {
      const r = await runCli(argv, { "a.csv": clean, "b.csv": clean });
      expect(r.code, argv.join(" ")).toBe(2);
      expect(r.stdout).toBe("");
    }
  });
});

describe("the draft's head", () => {
  it("starts with a schema line that points at the shipped schema", async () => {
    const r = await runCli(["infer", "d.csv"], { "d.csv": clean });
    const first = r.stdout.split("\n")[0] ?? "";
    const m = /^# yaml-language-server: \$schema=(.+)$/.exec(first);
    expect(m).not.toBeNull();
    const path = m?.[1] ?? "";
    // the test project folder is outside the repository, so the path is absolute here
    expect(isAbsolute(path) && existsSync(path) && path.endsWith("contract.schema.json")).toBe(true);
  });

  it("inside the repository, the path leads from its contracts/ folder to the schema", async () => {
    const root = fileURLToPath(new URL("../../", import.meta.url));
    const r = await tablegate(root, "infer", "contracts/samples/dealer-sales-w47.csv");
    const path = /^# yaml-language-server: \$schema=(.+)$/m.exec(r.out)?.[1] ?? "";
    expect(isAbsolute(path)).toBe(false);
    expect(existsSync(join(root, "contracts", path))).toBe(true);
  });

  it("takes --name, else the file name made into [a-z0-9-]+", async () => {
    expect((await inferFile(clean, "d.csv", ["--name", "weekly-stock"])).contract.name).toBe("weekly-stock");
    expect(nameFromFile("exports/Dealer Sales W47.csv.gz")).toBe("dealer-sales-w47");
    expect(nameFromFile("__.csv")).toBe("delivery");
    expect((await inferFile(clean, "Stock_Count.csv")).contract).toMatchObject({ tablegate: 1, name: "stock-count", version: "0.1.0" });
  });

  it("input: format, delimiter, the encoding found, header exact", async () => {
    const r = await inferFile(clean);
    expect(r.contract.input).toEqual({ format: "csv", delimiter: ",", encoding: "utf-8", header: "exact", blank: [""] });
  });
});

describe("formats and encodings", () => {
  it("tsv: no delimiter written", async () => {
    const r = await roundTrip("sku\tqty\nTENT, blue\t1\nMAP\t2\n", "d.tsv");
    expect(r.contract.input?.format).toBe("tsv");
    expect(r.contract.input?.delimiter).toBeUndefined();
    expect(r.check.code).toBe(0);
  });

  it("ndjson and .jsonl: JSON numbers and booleans read as their types", async () => {
    const data = '{"sku":"TENT","qty":2,"price":349.5,"gift":true}\n{"sku":"MAP","qty":1,"price":12,"gift":false}\n';
    for (const name of ["d.ndjson", "d.jsonl"]) {
      const r = await roundTrip(data, name);
      expect(r.contract.input?.format).toBe("ndjson");
      expect([column(r.contract, "qty").type, column(r.contract, "price").type, column(r.contract, "gift").type]).toEqual(["integer", "decimal", "boolean"]);
      expect(r.check.code).toBe(0);
    }
  });

  it("a header that only splits on ';' is read with ';'", async () => {
    const r = await roundTrip("sku;price\nTENT;349,50\nMAP;12,00\n");
    expect(r.contract.input?.delimiter).toBe(";");
    expect(column(r.contract, "price")).toMatchObject({ type: "decimal", decimal_mark: ",", scale: 2 });
    expect(r.check.code).toBe(0);
  });

  it("gzip-compressed files by their .gz suffix", async () => {
    const r = await roundTrip(gzipSync(Buffer.from(clean)), "d.csv.gz");
    expect(r.contract.name).toBe("d");
    expect(r.check.code).toBe(0);
  });

  it("windows-1252 bytes: the draft declares the encoding auto found", async () => {
    // 0xE9 is é in windows-1252 (WHATWG index-windows-1252) and not valid UTF-8 on its own
    const data = Buffer.concat([Buffer.from("city,qty\nMontr"), Buffer.from([0xe9]), Buffer.from("al,1\nQuebec,2\n")]);
    const r = await roundTrip(data);
    expect(r.contract.input?.encoding).toBe("windows-1252");
    expect(r.check.code).toBe(0);
  });
});

describe("records of another width", () => {
  it("are left out and noted; check then reports them as row.width", async () => {
    const data = "sku,qty\nTENT,1\nMAP,2,extra\nSTOVE,3\n";
    const r = await inferFile(data);
    expect(r.code).toBe(0);
    expect(r.stderr).toContain("d.csv");
    expect(r.stdout).toMatch(/line 3/);
    const check = await runCli(["check", "d.csv", "--contract", "c.yaml", "--report", "json=-"], { "d.csv": data, "c.yaml": r.stdout });
    expect(check.code).toBe(1);
    expect((JSON.parse(check.stdout) as { findings: { rule: string; line: number }[] }).findings.map((f) => [f.rule, f.line])).toEqual([["row.width", 3]]);
  });
});

describe("header names YAML must quote", () => {
  it("come back as written, and the draft passes its file", async () => {
    const data = 'Unit Price,#,"x: y",- a,\'q\',yes,"b\nc",\n1,2,3,4,5,6,7,8\n';
    const r = await roundTrip(data);
    expect(Object.keys(r.contract.columns)).toEqual(["Unit Price", "#", "x: y", "- a", "'q'", "yes", "b\nc", ""]);
    expect(r.check.code).toBe(0);
  });
});

describe("a shape the pattern screen refuses", () => {
  // Two runs of varying length, one past 16, side by side: a pattern the checker would refuse (README
  // "pattern"), so the draft leaves it out rather than failing to compile.
  it("is left out of the draft, which still compiles", async () => {
    const data = "code\nABCDEFGHIJKLMNOPQR-12345678901234567890\nAB-1\nABCDEFGHIJKLMNOPQRSTU-123456789012345678901\n";
    const r = await runCli(["infer", "d.csv"], { "d.csv": data });
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^ {2}code: \{type: text/m);
    expect(r.stdout).not.toMatch(/^ {2}code:.*pattern/m);
  });
});
