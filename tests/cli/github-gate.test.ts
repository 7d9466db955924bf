/**
 * The GitHub Actions gate (README "In CI"): with GITHUB_ACTIONS=true and no --report, stdout carries
 * the text report and workflow annotations; GITHUB_STEP_SUMMARY gets a Markdown summary appended.
 * Annotation syntax, escaping and limits are checked against /work/shared/notes/ci-formats.md,
 * "GitHub Actions workflow commands" (GitHub Actions documentation; actions/toolkit source):
 * `::error file=F,line=L,title=T::message`; message data escapes % CR LF as %25 %0D %0A, property
 * values also : and , as %3A %2C; at most 10 annotations of each level are shown per step.
 */
import { mkdir, mkdtemp, readFile, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { afterEach, describe, expect, it } from "vitest";
import { run } from "../../src/cli/run.js";
import type { DeliveryReport, Finding } from "../../src/report/model.js";

interface Outcome {
  readonly code: number;
  readonly stdout: string;
  readonly stderr: string;
}

/** One workflow command line taken apart, property values and message unescaped. */
interface Annotation {
  readonly command: string;
  readonly props: Readonly<Record<string, string>>;
  /** Property values as written, before unescaping. */
  readonly rawProps: Readonly<Record<string, string>>;
  readonly message: string;
}

const made: string[] = [];
afterEach(async () => {
  for (const d of made.splice(0)) await rm(d, { recursive: true, force: true });
});

async function folder(prefix: string): Promise<string> {
  const dir = await mkdtemp(join(tmpdir(), prefix));
  made.push(dir);
  return dir;
}

/** A repository root (an empty .git marks it) holding `files`. */
async function repo(files: Readonly<Record<string, string>>): Promise<string> {
  const dir = await folder("tablegate-gh-");
  await mkdir(join(dir, ".git"));
  for (const [name, content] of Object.entries(files)) {
    await mkdir(dirname(join(dir, name)), { recursive: true });
    await writeFile(join(dir, name), content);
  }
  return dir;
}

async function cli(cwd: string, argv: readonly string[], env: Readonly<Record<string, string>>): Promise<Outcome> {
  let stdout = "";
  let stderr = "";
  const code = await run(argv, { stdout: (s) => { stdout += s; }, stderr: (s) => { stderr += s; }, env: { NO_COLOR: "1", ...env }, cwd, stderrIsTty: false });
  return { code, stdout, stderr };
}

// Inverse of the escaping in ci-formats.md, written here from the note rather than taken from src/.
const DATA = { "%25": "%", "%0D": "\r", "%0A": "\n" } as const;
const PROPERTY = { ...DATA, "%3A": ":", "%2C": "," } as const;
const unescapeData = (s: string) => s.replace(/%(25|0D|0A)/g, (m) => DATA[m as keyof typeof DATA]);
const unescapeProperty = (s: string) => s.replace(/%(25|0D|0A|3A|2C)/g, (m) => PROPERTY[m as keyof typeof PROPERTY]);

/** Every `::command props::message` line of stdout. */
function annotations(o: Outcome): Annotation[] {
  const out: Annotation[] = [];
  for (const line of o.stdout.split("\n")) {
    const m = /^::([a-z]+)(?: ([^:]*))?::(.*)$/.exec(line);
    if (!m) continue;
    const rawProps: Record<string, string> = {};
    const props: Record<string, string> = {};
    for (const kv of (m[2] ?? "").split(",").filter((p) => p !== "")) {
      const eq = kv.indexOf("=");
      const key = kv.slice(0, eq);
      rawProps[key] = kv.slice(eq + 1);
      props[key] = unescapeProperty(kv.slice(eq + 1));
    }
    out.push({ command: m[1] ?? "", props, rawProps, message: unescapeData(m[3] ?? "") });
  }
  return out;
}

const errors = (o: Outcome) => annotations(o).filter((a) => a.command === "error");
const plainLines = (o: Outcome) => o.stdout.split("\n").filter((l) => !l.startsWith("::"));

/** The findings of a JSON run over the same repository, to compare annotations against. */
async function findings(dir: string, argv: readonly string[]): Promise<readonly Finding[]> {
  const o = await cli(dir, [...argv, "--report", "json=-"], {});
  const j = JSON.parse(o.stdout) as DeliveryReport | { deliveries: DeliveryReport[] };
  return "deliveries" in j ? j.deliveries.flatMap((d) => d.findings) : j.findings;
}

const contract = "tablegate: 1\nname: sales\ncolumns:\n  sku: { type: text, required: true }\n  qty: { type: integer, min: 1 }\n  note: { type: text }\n";
const project = 'tablegate: 1\ndeliveries:\n  - files: "deliveries/**/*.csv"\n    contract: contracts/sales.contract.yaml\n';
// Row 1 spans lines 2-3 (a quoted line break), so row 2 starts on line 4.
const failing = 'sku,qty,note\nTENT-2P,3,"packed\nin pairs"\nMAT-XL,0,\n';
const passing = "sku,qty,note\nTENT-2P,3,\nMAT-XL,1,\n";
const gh = { GITHUB_ACTIONS: "true" };

describe("GITHUB_ACTIONS=true and no --report", () => {
  it("prints the text report and ::error annotations on the finding's physical line", async () => {
    const dir = await repo({ "tablegate.yaml": project, "contracts/sales.contract.yaml": contract, "deliveries/sales/w01.csv": failing });
    const o = await cli(dir, ["check"], gh);
    expect(o.code).toBe(1);
    const text = plainLines(o);
    expect(text.some((l) => l.includes("deliveries/sales/w01.csv"))).toBe(true);
    expect(text.some((l) => l.includes("qty.min"))).toBe(true);
    const errs = errors(o);
    expect(errs.map((a) => [a.props.file, a.props.line, a.props.title])).toEqual([["deliveries/sales/w01.csv", "4", "qty.min"]]);
    // GitHub starts annotations with the `::` at the beginning of a line: none may be indented or glued.
    expect(o.stdout.split("\n").filter((l) => l.includes("::error")).every((l) => l.startsWith("::error "))).toBe(true);
  });

  it("annotation paths are relative to the repository, wherever the command runs", async () => {
    const dir = await repo({ "tablegate.yaml": project, "contracts/sales.contract.yaml": contract, "deliveries/sales/w01.csv": failing });
    const fromSub = await cli(join(dir, "deliveries", "sales"), ["check", "w01.csv"], gh);
    expect(errors(fromSub).map((a) => a.props.file)).toEqual(["deliveries/sales/w01.csv"]);
    const absolute = await cli(dir, ["check", join(dir, "deliveries/sales/w01.csv")], gh);
    expect(errors(absolute).map((a) => a.props.file)).toEqual(["deliveries/sales/w01.csv"]);
  });

  it("each annotation matches a finding of the JSON report: file, line, rule", async () => {
    const lines = ["sku,qty,note", "A,0,", "B,x,", '"",2,', 'C,3,"two', 'lines"', "D,-1,"];
    const dir = await repo({ "tablegate.yaml": project, "contracts/sales.contract.yaml": contract, "deliveries/d.csv": `${lines.join("\n")}\n` });
    const o = await cli(dir, ["check"], gh);
    const expected = (await findings(dir, ["check"])).map((f) => ["deliveries/d.csv", String(f.line ?? 1), f.rule]);
    expect(expected.length).toBe(4);
    expect(errors(o).map((a) => [a.props.file, a.props.line, a.props.title])).toEqual(expected);
    // D,-1 is on line 7: line 5-6 hold one record.
    expect(errors(o).at(-1)?.props.line).toBe("7");
  });

  it("a whole-file finding is placed on line 1", async () => {
    const withTotals = `${contract}totals:\n  rows: { min: 5 }\n`;
    const dir = await repo({ "tablegate.yaml": project, "contracts/sales.contract.yaml": withTotals, "deliveries/d.csv": passing });
    const o = await cli(dir, ["check"], gh);
    expect(o.code).toBe(1);
    expect(errors(o).map((a) => [a.props.line, a.props.title])).toEqual([["1", "totals.rows"]]);
  });

  it("a passing delivery prints no ::error (nor ::warning) and exits 0", async () => {
    const dir = await repo({ "tablegate.yaml": project, "contracts/sales.contract.yaml": contract, "deliveries/sales/w01.csv": passing });
    const o = await cli(dir, ["check"], gh);
    expect(o.code).toBe(0);
    expect(o.stdout).not.toMatch(/^::(error|warning)/m);
    expect(plainLines(o).some((l) => l.includes("deliveries/sales/w01.csv"))).toBe(true);
  });

  it("warnings and notes become ::warning and ::notice, and do not fail the run", async () => {
    const warn = `${contract}duplicates: warning\n`;
    const dir = await repo({ "tablegate.yaml": project, "contracts/sales.contract.yaml": warn, "deliveries/d.csv": `${passing}MAT-XL,1,\n` });
    const o = await cli(dir, ["check"], gh);
    expect(o.code).toBe(0);
    const a = annotations(o);
    expect(errors(o)).toEqual([]);
    expect(a.filter((x) => x.command === "warning").map((x) => [x.props.line, x.props.title])).toEqual([["4", "duplicates"]]);

    await writeFile(join(dir, "contracts/sales.contract.yaml"), `${contract}duplicates: note\n`);
    const n = annotations(await cli(dir, ["check"], gh));
    expect(n.filter((x) => x.command === "notice" && x.props.title === "duplicates").map((x) => x.props.line)).toEqual(["4"]);
  });

  it("at most 10 ::error lines per step; the rest are counted in one notice", async () => {
    // ci-formats.md: GitHub shows 10 errors per step (GitHub Actions documentation).
    const rows = Array.from({ length: 15 }, (_, i) => `S${i},0,`);
    const dir = await repo({ "tablegate.yaml": project, "contracts/sales.contract.yaml": contract, "deliveries/d.csv": `sku,qty,note\n${rows.join("\n")}\n` });
    const o = await cli(dir, ["check"], gh);
    expect(o.code).toBe(1);
    const errs = errors(o);
    expect(errs.map((a) => a.props.line)).toEqual(Array.from({ length: 10 }, (_, i) => String(i + 2)));
    const notices = annotations(o).filter((a) => a.command === "notice");
    expect(notices).toHaveLength(1);
    expect(notices[0]?.message).toMatch(/\b15\b/);
    expect(notices[0]?.message).toMatch(/\b5\b/);
  });

  it("a named report replaces the automatic annotations and summary", async () => {
    const dir = await repo({ "tablegate.yaml": project, "contracts/sales.contract.yaml": contract, "deliveries/sales/w01.csv": failing });
    const summary = join(await folder("tablegate-summary-"), "step.md");
    await writeFile(summary, "");
    const o = await cli(dir, ["check", "--report", "json=out.json"], { ...gh, GITHUB_STEP_SUMMARY: summary });
    expect(o.code).toBe(1);
    expect(annotations(o)).toEqual([]);
    expect(plainLines(o).some((l) => l.includes("deliveries/sales/w01.csv"))).toBe(true);
    expect(await readFile(summary, "utf8")).toBe("");
  });

  it("outside GitHub Actions no annotation is printed", async () => {
    const dir = await repo({ "tablegate.yaml": project, "contracts/sales.contract.yaml": contract, "deliveries/sales/w01.csv": failing });
    const o = await cli(dir, ["check"], {});
    expect(o.code).toBe(1);
    expect(annotations(o)).toEqual([]);
  });
});

describe("escaping (ci-formats.md, GitHub Actions workflow commands)", () => {
  // The column name and the file name carry , : % into property values (file=, title=); the cell
  // value carries % , : and a line break into the message.
  const col = "qty, 100%: units";
  const odd = `tablegate: 1\nname: odd\ncolumns:\n  sku: { type: text }\n  "${col}": { type: integer }\n`;
  const data = `sku,"${col}"\nA,"5%, 1:2\nx"\n`;
  const name = "deliveries/w,1:%.csv";

  it("property values escape % : , and the message escapes %; a value's line break reaches it only as the two characters \\n", async () => {
    const dir = await repo({ "tablegate.yaml": project.replace("contracts/sales.contract.yaml", "contracts/odd.contract.yaml"), "contracts/odd.contract.yaml": odd, [name]: data });
    const o = await cli(dir, ["check"], gh);
    expect(o.code).toBe(1);
    const [a, ...rest] = errors(o);
    expect(rest).toEqual([]);
    // Raw form, escaped as the note says ('%' first, so '%3A' in the input would stay distinguishable).
    expect(a?.rawProps.file).toBe("deliveries/w%2C1%3A%25.csv");
    expect(a?.rawProps.title).toBe("qty%2C 100%25%3A units.type");
    expect(a?.rawProps.line).toBe("2");
    // Decoded: exactly the path, rule and value of the JSON report.
    const [f] = await findings(dir, ["check"]);
    expect(f?.value).toBe("5%, 1:2\nx");
    expect(a?.props.file).toBe(name);
    expect(a?.props.title).toBe(f?.rule);
    // Messages show a value with control characters JSON-quoted, so no raw CR/LF is left to escape.
    expect(a?.message).toContain(JSON.stringify(f?.value));
    // The line break in the value must not end the command early: one ::error line in all.
    expect(o.stdout.split("\n").filter((l) => l.startsWith("::error"))).toHaveLength(1);
    const raw = o.stdout.split("\n").find((l) => l.startsWith("::error")) ?? "";
    expect(raw).toContain("5%25, 1:2\\nx");
    // In the message part ':' and ',' stay as they are (data escaping covers only % CR LF).
    expect(raw.slice(raw.indexOf("::", 2) + 2)).toContain(`${col.replace("%", "%25")}`);
  });

  it("a carriage return in a value never reaches the command raw", async () => {
    const dir = await repo({ "tablegate.yaml": project.replace("contracts/sales.contract.yaml", "contracts/odd.contract.yaml"), "contracts/odd.contract.yaml": odd, "deliveries/d.csv": `sku,"${col}"\r\nA,"7\r8"\r\n` });
    const o = await cli(dir, ["check"], gh);
    const raw = o.stdout.split("\n").filter((l) => l.startsWith("::error"));
    expect(raw).toHaveLength(1);
    expect(raw[0]).toContain("7\\r8");
    expect(raw[0]).not.toContain("\r");
  });

  // Bug (security): the text report that GITHUB_ACTIONS=true prints beside the annotations writes a
  // cell value's line break as is, so a delivery from a pull request can start a stdout line with
  // `::` and issue workflow commands of its own: forged annotations, or `::stop-commands::<token>`,
  // which makes the runner ignore every later command, tablegate's real ::error lines included
  // (ci-formats.md: commands are lines of the form `::command ...::message`). Expected: the only
  // lines starting with `::` are tablegate's annotations. Actual: a line
  // `::notice title=forged::all good is not an integer` appears. Suspected: src/report/text.ts
  // checkBlock, which prints f.message (holding the raw value) without escaping control characters.
  it("a value cannot start a workflow command line of its own", async () => {
    const dir = await repo({ "tablegate.yaml": project, "contracts/sales.contract.yaml": contract, "deliveries/d.csv": 'sku,qty,note\nA,"1\n::notice title=forged::all good",\n' });
    const o = await cli(dir, ["check"], gh);
    expect(o.code).toBe(1);
    const commands = o.stdout.split("\n").filter((l) => l.startsWith("::"));
    expect(commands.length).toBeGreaterThan(0);
    expect(commands.filter((l) => l.includes("forged") && !l.startsWith("::error file=deliveries/d.csv,"))).toEqual([]);
  });

  it("a sensitive column's value is masked in annotations and the summary", async () => {
    const secret = `${contract.replace("note: { type: text }", "note: { type: text, format: email, sensitive: true }")}`;
    const dir = await repo({ "tablegate.yaml": project, "contracts/sales.contract.yaml": secret, "deliveries/d.csv": "sku,qty,note\nA,1,ranger-at-lakeside\n" });
    const summary = join(await folder("tablegate-summary-"), "step.md");
    const o = await cli(dir, ["check"], { ...gh, GITHUB_STEP_SUMMARY: summary });
    expect(o.code).toBe(1);
    expect(errors(o).map((a) => a.props.title)).toEqual(["note.format"]);
    expect(o.stdout).not.toContain("ranger-at-lakeside");
    expect(await readFile(summary, "utf8")).not.toContain("ranger-at-lakeside");
  });
});

describe("GITHUB_STEP_SUMMARY", () => {
  it("gets Markdown appended, keeping what earlier steps wrote", async () => {
    const dir = await repo({ "tablegate.yaml": project, "contracts/sales.contract.yaml": contract, "deliveries/sales/w01.csv": failing });
    const summary = join(await folder("tablegate-summary-"), "step.md");
    const before = "## Build\n\nAll packages built.\n";
    await writeFile(summary, before);
    const o = await cli(dir, ["check"], { ...gh, GITHUB_STEP_SUMMARY: summary });
    expect(o.code).toBe(1);
    const after = await readFile(summary, "utf8");
    expect(after.startsWith(before)).toBe(true);
    const added = after.slice(before.length).split("\n");
    expect(added[0]).toMatch(/^#{1,6} /);
    // A Markdown table row for the failed check, with its contract line (qty is declared on line 5).
    const row = added.find((l) => l.startsWith("|") && l.includes("qty.min") && !/\|\s*4\s*\|/.test(l));
    expect(row?.split("|").map((c) => c.trim())).toContain("5");
    // And the finding, with its physical line.
    expect(added.some((l) => l.startsWith("|") && l.includes("qty.min") && /\|\s*4\s*\|/.test(l))).toBe(true);
    expect(added.some((l) => l.includes("deliveries/sales/w01.csv"))).toBe(true);

    // A second run appends again rather than replacing.
    await cli(dir, ["check"], { ...gh, GITHUB_STEP_SUMMARY: summary });
    const twice = await readFile(summary, "utf8");
    expect(twice.startsWith(after)).toBe(true);
    expect(twice.length - before.length).toBe(2 * (after.length - before.length));
  });

  it("a passing run appends a summary too, and the annotations stay empty", async () => {
    const dir = await repo({ "tablegate.yaml": project, "contracts/sales.contract.yaml": contract, "deliveries/sales/w01.csv": passing });
    const summary = join(await folder("tablegate-summary-"), "step.md");
    const o = await cli(dir, ["check"], { ...gh, GITHUB_STEP_SUMMARY: summary });
    expect(o.code).toBe(0);
    expect(errors(o)).toEqual([]);
    const text = await readFile(summary, "utf8");
    expect(text).toMatch(/^#{1,6} /);
    expect(text).toContain("deliveries/sales/w01.csv");
  });

  it("--report github=- appends it outside GITHUB_ACTIONS too, with text on stdout as well", async () => {
    const dir = await repo({ "tablegate.yaml": project, "contracts/sales.contract.yaml": contract, "deliveries/sales/w01.csv": failing });
    const summary = join(await folder("tablegate-summary-"), "step.md");
    const o = await cli(dir, ["check", "--report", "github=-"], { GITHUB_STEP_SUMMARY: summary });
    expect(o.code).toBe(1);
    expect(errors(o).map((a) => a.props.line)).toEqual(["4"]);
    expect(plainLines(o).some((l) => l.includes("qty.min"))).toBe(true);
    expect(await readFile(summary, "utf8")).toContain("qty.min");
  });

  it("a summary file that cannot be written: 2 with one line naming it", async () => {
    const dir = await repo({ "tablegate.yaml": project, "contracts/sales.contract.yaml": contract, "deliveries/sales/w01.csv": passing });
    const summary = join(await folder("tablegate-summary-"), "no-such-folder", "step.md");
    const o = await cli(dir, ["check"], { ...gh, GITHUB_STEP_SUMMARY: summary });
    expect(o.code).toBe(2);
    expect(o.stderr.split("\n").filter((l) => l !== "")).toHaveLength(1);
    expect(o.stderr).toContain(summary);
  });

  // Bug: the summary is appended as is, so when an earlier step left the file without a final line
  // break the heading is glued to that last line ("All packages built.## tablegate: ...") and
  // Markdown no longer renders it as a heading. Expected: the appended summary starts on a line of
  // its own. Suspected: src/cli/reports.ts (appendFile of githubSummary's text, which starts with the
  // heading) — it could read the file's last byte, or the summary could start with a blank line.
  it("starts on a new line when earlier content has no final line break", async () => {
    const dir = await repo({ "tablegate.yaml": project, "contracts/sales.contract.yaml": contract, "deliveries/sales/w01.csv": failing });
    const summary = join(await folder("tablegate-summary-"), "step.md");
    await writeFile(summary, "All packages built.");
    await cli(dir, ["check"], { ...gh, GITHUB_STEP_SUMMARY: summary });
    const lines = (await readFile(summary, "utf8")).split("\n");
    expect(lines[0]).toBe("All packages built.");
    expect(lines.slice(1).find((l) => l !== "")).toMatch(/^#{1,6} /);
  });
});
