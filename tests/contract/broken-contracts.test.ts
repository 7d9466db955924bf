/**
 * Broken contracts (SPEC §1 and §3): `lint` and `check` both stop with exit 2 and print one line per
 * problem naming `contract.yaml:line:col`. Positions were worked out by hand from the YAML text
 * (1-based, as editors count them). Wording is never asserted, only where it points.
 */
import { describe, expect, it } from "vitest";
import { runCli, type CliRun } from "../helpers/cli.js";

interface BrokenCase {
  readonly name: string;
  readonly contract: string;
  /** Every expected problem position, in any order. */
  readonly at: readonly (readonly [line: number, column: number])[];
  /** A known disagreement: the engine points elsewhere; the test is expected to fail until fixed. */
  readonly pending?: string;
}

const head = "tablegate: 1\nname: broken\n";

const cases: readonly BrokenCase[] = [
  {
    name: "unknown top-level key",
    contract: head + "colums:\n  a: { type: text }\ncolumns:\n  a: { type: text }\n",
    at: [[3, 1]],
  },
  {
    name: "unknown column option (flow mapping)",
    contract: head + "columns:\n  a: { type: text, max_lenght: 3 }\n",
    at: [[4, 20]],
  },
  {
    name: "min that is not a number on an integer column",
    contract: head + 'columns:\n  qty:\n    type: integer\n    min: "abc"\n',
    at: [[6, 10]],
  },
  {
    name: "unknown column type",
    contract: head + "columns:\n  a:\n    type: txt\n",
    at: [[5, 11]],
  },
  {
    name: "pattern that is not a regular expression (points at its first character, inside the quotes)",
    contract: head + "columns:\n  a:\n    type: text\n    pattern: '^[A-Z'\n",
    at: [[6, 15]],
  },
  {
    name: "date format with an unknown directive (points at the directive inside the value)",
    contract: head + 'columns:\n  d:\n    type: date\n    format: "%Y-%q-%d"\n',
    at: [[6, 17]],
  },
  {
    // One mistake, one message: the map form of codes lacks its column; that it is not a list too says nothing.
    name: "codes as a map without its column",
    contract: head + "columns:\n  kind: { type: text, codes: { table: iso-3166-1 } }\n",
    at: [[4, 30]],
  },
  {
    // SPEC §1.1 lists percent under decimal only.
    name: "an option of another column type (percent on an integer)",
    contract: head + "columns:\n  share: { type: integer, percent: true }\n",
    at: [[4, 27]],
  },
  {
    name: "a boolean's values on a text column",
    contract: head + "columns:\n  flag:\n    type: text\n    values: { true: [Y], false: [N] }\n",
    at: [[6, 5]],
  },
  {
    // SPEC §1: "delimiter: ... # csv only".
    name: "a delimiter on a tsv input",
    contract: head + "input:\n  format: tsv\n  delimiter: ';'\ncolumns:\n  a: { type: text }\n",
    at: [[5, 3]],
  },
  {
    name: "a max below the min: no value could pass",
    contract: head + "columns:\n  age:\n    type: integer\n    min: 12\n    max: 8\n",
    at: [[7, 5]],
  },
  {
    name: "a max_length below the min_length",
    contract: head + "columns:\n  code: { type: text, min_length: 8, max_length: 4 }\n",
    at: [[4, 38]],
  },
  {
    name: "a column twice in one key",
    contract: head + "columns:\n  worker: { type: text }\nkeys:\n  - [worker, worker]\n",
    at: [[6, 14]],
  },
  {
    name: "an empty codes list: one message",
    contract: head + "columns:\n  a: { type: text, codes: [] }\n",
    at: [[4, 27]],
  },
  {
    name: "a second YAML document in the contract file",
    contract: head + "columns:\n  a: { type: text }\n---\nname: y\n",
    at: [[5, 1]],
  },
  {
    // SPEC 1.2: a rule id names one check.
    name: "two rules with one id: at the second",
    contract: head + "columns:\n  qty: { type: integer }\nrules:\n  - id: r\n    assert: qty > 0\n  - id: r\n    assert: qty < 9\n",
    at: [[8, 5]],
  },
  {
    name: "totals.rows whose max is below its min",
    contract: head + "columns:\n  a: { type: text }\ntotals:\n  rows: { min: 5, max: 2 }\n",
    at: [[6, 19]],
  },
  {
    name: "a quote character equal to the delimiter",
    contract: head + "input:\n  delimiter: '|'\n  quote: '|'\ncolumns:\n  a: { type: text }\n",
    at: [[5, 3]],
  },
  {
    name: "a line break as the delimiter",
    contract: head + 'input:\n  delimiter: "\\n"\ncolumns:\n  a: { type: text }\n',
    at: [[4, 3]],
  },
  {
    // One misspelt key is one mistake: the unknown-key message names the key it should be.
    name: "a misspelt required key: one message, at the misspelt key",
    contract: head + "columns:\n  a: { type: text }\nrules:\n  - id: r\n    asert: a IS NOT NULL\n",
    at: [[7, 5]],
  },
  {
    name: "bad expression, plain scalar: the second > of qty >> 3",
    contract: head + "columns:\n  qty: { type: integer }\nrules:\n  - id: r1\n    assert: qty >> 3\n",
    at: [[7, 18]],
  },
  {
    name: "bad expression, double-quoted scalar: the second =",
    contract: head + 'columns:\n  qty: { type: integer }\nrules:\n  - id: r1\n    assert: "qty = = 3"\n',
    at: [[7, 20]],
  },
  {
    // YAML 1.2 section 5.7: each escape is one character of the value, however many it takes in the file.
    name: "bad expression, double-quoted scalar with escapes before the fault (\\t, \\x41, \\u00e9, \\U0001F3D5)",
    contract: head + 'columns:\n  qty: { type: integer }\n  code: { type: text }\nrules:\n  - id: r1\n    assert: "code <> \'\\t\\x41\\u00e9\\U0001F3D5\' AND qty >> 3"\n',
    at: [[8, 56]],
  },
  {
    name: "bad expression, double-quoted scalar continued after an escaped line break",
    contract: head + 'columns:\n  qty: { type: integer }\nrules:\n  - id: r1\n    assert: "qty > 0 AND \\\n      qty >> 3"\n',
    at: [[8, 12]],
  },
  {
    name: "bad expression, single-quoted scalar with '' escapes before the fault",
    contract: head + "columns:\n  qty: { type: integer }\n  code: { type: text }\nrules:\n  - id: r1\n    assert: 'code = ''A'' AND qty = = 1'\n",
    at: [[8, 37]],
  },
  {
    name: "bad expression, folded block scalar: the fault on its second line",
    contract: head + "columns:\n  qty: { type: integer }\n  price: { type: decimal }\nrules:\n  - id: r1\n    assert: >-\n      qty > 0 AND\n      price < < 5\n",
    at: [[10, 15]],
  },
  {
    name: "unknown column named in an expression",
    contract: head + "columns:\n  qty: { type: integer }\nrules:\n  - id: r1\n    assert: qyt > 0\n",
    at: [[7, 13]],
  },
  {
    name: "bad expression in a column when",
    contract: head + "columns:\n  country: { type: text }\n  state: { type: text, when: \"country = = 'US'\" }\n",
    at: [[5, 41]],
  },
  {
    name: "unknown column in keys",
    contract: head + "columns:\n  a: { type: text }\nkeys:\n  - [a, bb]\n",
    at: [[6, 9]],
  },
  {
    // The yaml package notices a missing closing quote at the end of the input; the mistake is where it opened.
    name: "YAML syntax error: unclosed double quote (points at the quote that opened)",
    contract: 'tablegate: 1\nname: "broken\ncolumns:\n  a: { type: text }\n',
    at: [[2, 7]],
  },
  {
    // One slip, one message: later errors the library finds follow from the first.
    name: "YAML: the first item of a mapping indented one space short (points at it, not at the items after)",
    contract: head + "columns:\n a: { type: text }\n  b: { type: text }\n  c: { type: text }\n",
    at: [[4, 2]],
  },
  {
    name: "YAML: one item indented less than the one before it",
    contract: head + "columns:\n    a: { type: text }\n    b: { type: text }\n   c: { type: text }\n",
    at: [[6, 4]],
  },
  {
    name: "YAML: a line indented deeper than its neighbours (points at that line)",
    contract: head + "input:\n  format: csv\n   encoding: utf-8\ncolumns:\n  a: { type: text }\n",
    at: [[5, 4]],
  },
  {
    name: "YAML: a tab as indentation",
    contract: head + "columns:\n\ta: { type: text }\n",
    at: [[4, 1]],
  },
  {
    name: "YAML: no space after a key's colon",
    contract: "tablegate: 1\nname:broken\ncolumns:\n  a: { type: text }\n",
    at: [[2, 1]],
  },
  {
    name: "YAML: a flow map without its closing brace (points at the brace that opened)",
    contract: head + "columns:\n  a: { type: text\n  b: { type: text }\n",
    at: [[4, 6]],
  },
  {
    name: "YAML: a flow list without its closing bracket",
    contract: head + "columns:\n  a: { type: text, codes: [X, Y }\n  b: { type: text }\n",
    at: [[4, 27]],
  },
  {
    // SPEC §1.3 quotes names with double quotes; the whole YAML value then needs the other quotes.
    name: "YAML: text after a quoted value's closing quote",
    contract: head + 'columns:\n  a: { type: text }\nrules:\n  - id: r\n    assert: "a" <= "b"\n',
    at: [[7, 17]],
  },
  {
    name: "YAML: an alias to an anchor never set",
    contract: head + "columns:\n  a: *nope\n",
    at: [[4, 6]],
  },
  {
    // Each alias of x2 expands ten of x1, each of those ten of x0: far past 100 expansions.
    name: "YAML: more alias expansions than a contract needs (points at the first alias)",
    contract: head + "x0: &a [1,1,1,1,1,1,1,1,1,1]\nx1: &b [*a,*a,*a,*a,*a,*a,*a,*a,*a,*a]\nx2: &c [*b,*b,*b,*b,*b,*b,*b,*b,*b,*b]\ncolumns:\n  a: { type: text }\n",
    at: [[4, 9]],
  },
  {
    name: "YAML: the same column declared twice",
    contract: head + "columns:\n  a: { type: text }\n  a: { type: integer }\n",
    at: [[5, 3]],
  },
  {
    name: "missing required name (points at the document's top mapping)",
    contract: "tablegate: 1\ncolumns:\n  a: { type: text }\n",
    at: [[1, 1]],
  },
  {
    name: "two problems in one file: one line each",
    contract: head + "columns:\n  a: { type: text, max_lenght: 3 }\n  b: { type: txt }\n",
    at: [[4, 20], [5, 14]],
  },
  {
    name: "unknown column in outliers",
    contract: head + "columns:\n  price: { type: decimal }\noutliers:\n  - { column: pricee, method: tukey }\n",
    at: [[6, 15]],
  },
  {
    name: "unknown column in totals.blank_share (points at the key)",
    contract: head + "columns:\n  price: { type: decimal }\ntotals:\n  blank_share: { pricee: 0.1 }\n",
    at: [[6, 18]],
  },
  {
    name: "codes from a table the registry does not have",
    contract: head + "columns:\n  a: { type: text, codes: { table: nope, column: x } }\n",
    at: [[4, 36]],
  },
  {
    name: "an option that does not apply to the column type (max_length on integer)",
    contract: head + "columns:\n  qty: { type: integer, max_length: 3 }\n",
    at: [[4, 25]],
  },
  {
    name: "unknown function in an expression",
    contract: head + "columns:\n  code: { type: text }\nrules:\n  - id: r1\n    assert: lenght(code) > 3\n",
    at: [[7, 13]],
  },
  {
    name: "name that breaks the [a-z0-9-]+ rule",
    contract: "tablegate: 1\nname: Broken\ncolumns:\n  a: { type: text }\n",
    at: [[2, 7]],
  },
];

/** The `contract.yaml:L:C` positions printed on stderr, one per non-empty line. */
function positions(r: CliRun): { lines: string[]; at: [number, number][] } {
  const lines = r.stderr.split("\n").filter((l) => l.trim() !== "");
  const at = lines.map((l): [number, number] => {
    const m = /contract\.yaml:(\d+):(\d+)\b/.exec(l);
    return m ? [Number(m[1]), Number(m[2])] : [0, 0];
  });
  return { lines, at };
}

const byPosition = (a: readonly [number, number], b: readonly [number, number]) => a[0] - b[0] || a[1] - b[1];

describe("broken contracts", () => {
  for (const c of cases) {
    for (const command of ["lint", "check"] as const) {
      (c.pending ? it.fails : it)(`${command}: ${c.name}`, async () => {
        const argv = command === "lint" ? ["lint", "contract.yaml"] : ["check", "data.csv", "--contract", "contract.yaml", "--report", "json=-"];
        const r = await runCli(argv, { "contract.yaml": c.contract, "data.csv": "a\n1\n" });
        const got = positions(r);
        expect({ code: r.code, stdout: command === "check" ? r.stdout : "", at: [...got.at].sort(byPosition) }, r.stderr).toEqual({
          code: 2,
          stdout: "",
          at: [...c.at].sort(byPosition),
        });
        expect(r.stderr).not.toMatch(/\n\s+at /);
      });
    }
  }

  it("an unknown column type lists the valid types", async () => {
    const r = await runCli(["lint", "contract.yaml"], { "contract.yaml": head + "columns:\n  a:\n    type: txt\n" });
    expect(r.code).toBe(2);
    for (const t of ["text", "integer", "decimal", "boolean", "date", "timestamp", "time"]) expect(r.stderr).toContain(t);
  });

  it("lint of a sound contract exits 0 and says nothing on stderr", async () => {
    const r = await runCli(["lint", "contract.yaml"], { "contract.yaml": head + "columns:\n  a: { type: text }\n" });
    expect({ code: r.code, stderr: r.stderr }).toEqual({ code: 0, stderr: "" });
  });

  it("lists nested thousands deep are one line on the line where they are, not a crash", async () => {
    // The yaml package stops where its parser runs out of stack (RESOURCE_EXHAUSTION); how deep that
    // is depends on the stack, so only the line is pinned.
    const r = await runCli(["lint", "contract.yaml"], { "contract.yaml": head + "columns:\n  a: { type: text }\nx: " + "[".repeat(3000) + "]".repeat(3000) + "\n" });
    expect(r.code).toBe(2);
    expect(r.stderr.trim().split("\n")).toHaveLength(1);
    expect(r.stderr).toMatch(/^tablegate: contract\.yaml:5:\d+: /);
  });

  it("up to 100 alias expansions are read; the 101st is refused at its place", async () => {
    const many = (n: number) => head + "columns:\n  c: &t { type: text }\n" + Array.from({ length: n }, (_, i) => `  c${i}: *t\n`).join("");
    const hundred = await runCli(["lint", "contract.yaml"], { "contract.yaml": many(100) });
    expect({ code: hundred.code, stderr: hundred.stderr }).toEqual({ code: 0, stderr: "" });
    const more = await runCli(["lint", "contract.yaml"], { "contract.yaml": many(101) });
    expect(more.code).toBe(2);
    expect(more.stderr).toMatch(/^tablegate: contract\.yaml:\d+:\d+: /);
  });

  it("YAML merge keys (<<: *anchor) share column options", async () => {
    const r = await runCli(["check", "data.csv", "--contract", "contract.yaml", "--report", "json=-"], {
      "contract.yaml": head + "columns:\n  a: &code { type: text, max_length: 2 }\n  b: { <<: *code, required: true }\n",
      "data.csv": "a,b\nAB,\nABC,XYZ\n",
    });
    const report = JSON.parse(r.stdout) as { findings: { rule: string; row: number }[] };
    expect(report.findings.map((f) => `${f.rule}@${f.row}`)).toEqual(["b.required@1", "a.max_length@2", "b.max_length@2"]);
  });

  it("lint reports each broken contract of several, naming each file", async () => {
    const r = await runCli(["lint", "one.yaml", "two.yaml"], {
      "one.yaml": head + "columns:\n  a: { type: txt }\n",
      "two.yaml": head + "columns:\n  a: { type: text, bogus: 1 }\n",
    });
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/one\.yaml:4:\d+/);
    expect(r.stderr).toMatch(/two\.yaml:4:\d+/);
  });

  it("a missing contract file is exit 2 with one line naming it", async () => {
    const r = await runCli(["lint", "nowhere.yaml"]);
    const lines = r.stderr.split("\n").filter((l) => l.trim() !== "");
    expect({ code: r.code, lines: lines.length }).toEqual({ code: 2, lines: 1 });
    expect(r.stderr).toContain("nowhere.yaml");
  });
});

describe("a contract that is not UTF-8", () => {
  // YAML 1.2 (section 5.2) streams are Unicode; a Latin-1 byte would silently become U+FFFD.
  it("is refused at the first bad byte, in one line", async () => {
    const bytes = Buffer.concat([Buffer.from(head + 'columns:\n  a: { type: text, description: "caf'), Buffer.from([0xe9]), Buffer.from('" }\n')]);
    for (const command of ["lint", "check"] as const) {
      const argv = command === "lint" ? ["lint", "contract.yaml"] : ["check", "data.csv", "--contract", "contract.yaml"];
      const r = await runCli(argv, { "contract.yaml": bytes, "data.csv": "a\n1\n" });
      expect({ code: r.code, lines: r.stderr.trim().split("\n").length }).toEqual({ code: 2, lines: 1 });
      expect(r.stderr).toMatch(/contract\.yaml:4:37: /);
    }
  });
});
