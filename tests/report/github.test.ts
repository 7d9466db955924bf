import { describe, expect, test } from "vitest";
import { ANNOTATIONS_PER_LEVEL, githubAnnotations } from "../../src/report/github-annotations.js";
import { STEP_SUMMARY_LIMIT, SUMMARY_FINDINGS_PER_DELIVERY, githubSummary } from "../../src/report/github-summary.js";
import { mdCell } from "../../src/report/markdown.js";
import type { DeliveryReport, Finding } from "../../src/report/model.js";
import { escapeData, escapeProperty, workflowCommand } from "../../src/report/workflow-command.js";
import { bulk, ctx, returns, sales } from "./fixture.js";
import { expectGolden } from "./golden.js";

// Workflow command syntax and escaping: GitHub Actions documentation and actions/toolkit
// (packages/core command.ts escapeData/escapeProperty), as summarised in shared/notes/ci-formats.md.
const COMMAND = /^::(error|warning|notice) ([^:]*)::(.*)$/;
const unescapeData = (s: string): string => s.replace(/%0D/g, "\r").replace(/%0A/g, "\n").replace(/%25/g, "%");
const unescapeProperty = (s: string): string => unescapeData(s.replace(/%3A/g, ":").replace(/%2C/g, ","));

interface Annotation { kind: string; props: Record<string, string>; message: string }
function parse(out: string): Annotation[] {
  return out
    .split("\n")
    .filter((l) => l !== "")
    .map((line) => {
      const m = COMMAND.exec(line);
      if (m === null) throw new Error(`not a workflow command: ${line}`);
      const props: Record<string, string> = {};
      for (const kv of (m[2] ?? "").split(",")) {
        const eq = kv.indexOf("=");
        props[kv.slice(0, eq)] = unescapeProperty(kv.slice(eq + 1));
      }
      return { kind: m[1] ?? "", props, message: unescapeData(m[3] ?? "") };
    });
}

describe("workflow command escaping (toolkit rules)", () => {
  test("data: % first, then CR and LF", () => {
    expect(escapeData("50% off\r\nnext")).toBe("50%25 off%0D%0Anext");
    expect(escapeData("%0A")).toBe("%250A");
  });
  test("properties also escape ':' and ','", () => {
    expect(escapeProperty("a:b,c%\n")).toBe("a%3Ab%2Cc%25%0A");
    expect(workflowCommand("error", [["file", "x,y.csv"], ["line", 3]], "bad: value")).toBe("::error file=x%2Cy.csv,line=3::bad: value");
  });
});

describe("github annotations", () => {
  const out = githubAnnotations([sales, returns], ctx);
  const notes = parse(out);

  test("one line per annotation; hostile values cannot start a command of their own", () => {
    expect(out.endsWith("\n")).toBe(true);
    // the notes.spaces value holds CR LF: it must not split the line
    expect(out.split("\n").filter((l) => l !== "")).toHaveLength(sales.findings.length + 1);
    const spaces = notes.find((n) => n.props.title === "notes.spaces");
    expect(spaces?.message).toContain(JSON.stringify(" 50%, rush: call\r\nback "));
  });

  test("file, line and title per finding; round trip through the escaping", () => {
    const discount = notes.filter((n) => n.props.title === "discount.max");
    expect(discount.map((n) => [n.kind, n.props.file, n.props.line])).toEqual([
      ["error", "deliveries/dealer-sales/w48.csv", "18"],
      ["error", "deliveries/dealer-sales/w48.csv", "231"],
      ["error", "deliveries/dealer-sales/w48.csv", "4104"],
    ]);
    expect(notes.find((n) => n.props.title === "key:invoice_no+line_no")?.props.title).toBe("key:invoice_no+line_no");
    expect(notes.find((n) => n.props.title === "group:invoice-total")?.props.line).toBe("1");
    expect(notes.find((n) => n.props.title === "header.unexpected")?.kind).toBe("notice");
  });

  test("most severe first, then one totals notice", () => {
    const kinds = notes.map((n) => n.kind);
    expect(kinds.slice(0, 10)).toEqual(Array(10).fill("error"));
    expect(kinds.slice(10)).toEqual(["warning", "warning", "warning", "notice", "notice"]);
    const totals = notes.at(-1)!;
    expect(totals.props.title).toBe("tablegate totals");
    expect(totals.message).toContain("14 findings");
    expect(totals.message).not.toContain("more");
  });

  test("per-level limits with the rest counted in the totals notice", () => {
    const many: DeliveryReport = {
      ...bulk(40, 25),
      findings: [...bulk(40, 25).findings, ...Array.from({ length: 15 }, (_, i): Finding => ({ rule: "header.unexpected", level: "note", line: 1, message: `note ${i}` }))],
      counts: { error: 40, warning: 25, note: 15, rows_failed: 65 },
    };
    const got = parse(githubAnnotations([many], ctx));
    const count = (k: string): number => got.filter((n) => n.kind === k).length;
    expect(count("error")).toBe(ANNOTATIONS_PER_LEVEL);
    expect(count("warning")).toBe(ANNOTATIONS_PER_LEVEL);
    expect(count("notice")).toBe(ANNOTATIONS_PER_LEVEL); // 9 notes + the totals
    expect(got.length).toBeLessThanOrEqual(50); // per-job limit
    expect(got.at(-1)?.message).toContain("and 51 more findings");
  });

  test("the totals count findings the engine cut", () => {
    const cut = bulk(500, 0, 100);
    expect(parse(githubAnnotations([cut], ctx)).at(-1)?.message).toContain("and 490 more findings");
  });

  test("nothing to say for clean deliveries; golden", () => {
    expect(githubAnnotations([returns], ctx)).toBe("");
    expectGolden("github-annotations.txt", out);
  });
});

describe("github step summary", () => {
  const md = githubSummary([sales, returns], ctx);

  test("verdict, exact counts, failing checks with contract lines, first findings", () => {
    expect(md).toMatch(/^## tablegate: 1 delivery of 2 failed\n/);
    expect(md).toContain("14 problems in 12 of 5,000 rows: 10 errors, 3 warnings, 1 note.");
    expect(md).toContain("| `discount.max` | error | 3 | discount at most 0.6 | 22 |");
    expect(md).toContain("| `outlier:unit_price` | warning | 2 (within allowance) |");
    expect(md).toContain("No problems in 120 rows.");
  });

  test("delivery values cannot break the table or inject HTML", () => {
    const row = md.split("\n").find((l) => l.includes("`dealer_name.max_length`") && l.includes("| 777 |"));
    expect(row).toContain("&lt;script&gt;alert('x')&lt;/script&gt; &amp; Summit Outfitters");
    expect(md).not.toContain("<script>");
    const spaces = md.split("\n").find((l) => l.includes("| 2048 |")) ?? "";
    expect(spaces).toContain(" 50%, rush: call\\\\r\\\\nback ");
    // every table row keeps its column count: escaped pipes do not split cells
    for (const l of md.split("\n").filter((x) => x.startsWith("| `"))) {
      expect(l.split(/(?<!\\)\|/).length === 7 || l.split(/(?<!\\)\|/).length === 8).toBe(true);
    }
    expect(mdCell("a|b")).toBe("a\\|b");
    expect(mdCell("[x](javascript:alert(1))")).toBe("\\[x\\](javascript:alert(1))");
  });

  test("lists at most the first findings per delivery, then says how many more", () => {
    const out = githubSummary([bulk(300)], ctx);
    expect(out.split("\n").filter((l) => /^\| `qty\.max` \| \d+ \| \d+ \|/.test(l))).toHaveLength(SUMMARY_FINDINGS_PER_DELIVERY);
    expect(out).toContain("and 250 more findings; see the full report.");
  });

  test("stays under GitHub's 1 MiB step summary limit, with a note when cut", () => {
    const long = "X".repeat(2000);
    const heavy = Array.from({ length: 40 }, (_, k): DeliveryReport => {
      const b = bulk(60);
      return { ...b, input: { ...b.input, path: `deliveries/dealer-${k}.csv` }, findings: b.findings.map((f) => ({ ...f, value: long })) };
    });
    const out = githubSummary(heavy, ctx);
    expect(Buffer.byteLength(out, "utf8")).toBeLessThanOrEqual(STEP_SUMMARY_LIMIT);
    expect(Buffer.byteLength(out, "utf8")).toBeGreaterThan(STEP_SUMMARY_LIMIT - 200_000);
    expect(out).toContain("Summary cut here");
    expect(md).not.toContain("Summary cut here");
  });

  test("golden", () => {
    expectGolden("github-summary.md", md);
  });
});
