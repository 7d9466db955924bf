import { existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
import { chromium } from "playwright-core";
import { afterAll, describe, expect, test } from "vitest";
import { HTML_FINDINGS_PER_CHECK, html } from "../../src/report/html.js";
import { escapeHtml, htmlValue } from "../../src/report/html-escape.js";
import type { DeliveryReport } from "../../src/report/model.js";
import { bulk, ctx, returns, sales } from "./fixture.js";
import { expectGolden } from "./golden.js";

const page = html([sales, returns], ctx);

describe("html report as text", () => {
  test("self-contained: no script, no external resource of any kind", () => {
    expect(page).not.toMatch(/<script/i);
    expect(page).not.toMatch(/https?:|\/\/[a-z]/i);
    expect(page).not.toMatch(/\b(src|href)=/i);
    expect(page).not.toMatch(/url\(|@import/i);
    expect(page).toContain("default-src 'none'");
  });

  test("delivery values stay text (HTML Living Standard escaping)", () => {
    expect(escapeHtml(`<a href="x">'&'</a>`)).toBe("&lt;a href=&quot;x&quot;&gt;&#39;&amp;&#39;&lt;/a&gt;");
    expect(htmlValue(" a\r\nb\u0007 ")).toBe(" a\\r\\nb\\u0007 ");
    expect(page).toContain("<mark>&lt;script&gt;alert(&#39;x&#39;)&lt;/script&gt; &amp; Summit Outfitters</mark>");
  });

  test("a note stands in for a missing profile", () => {
    const noProfile = html([returns], ctx);
    expect(noProfile).toContain("This report has no column profile.");
    expect(noProfile).toContain("All 2 checks passed.");
  });

  test("at most the first findings per check, then how many more", () => {
    const big = html([bulk(HTML_FINDINGS_PER_CHECK + 7)], ctx);
    expect(big.match(/<mark>/g)).toHaveLength(HTML_FINDINGS_PER_CHECK);
    expect(big).toContain("and 7 more problems of this kind");
  });

  test("deterministic, no elapsed time; golden", () => {
    expect(html([{ ...sales, elapsed_ms: 1 }, returns], ctx)).toBe(page);
    expectGolden("report.html", page);
  });
});

const CHROMIUM = "/usr/bin/chromium";
const haveChromium = existsSync(CHROMIUM);
if (!haveChromium) console.warn(`html browser test skipped: ${CHROMIUM} is absent (apt-get install -y chromium)`);

describe.skipIf(!haveChromium)("html report in headless Chromium", () => {
  const dir = mkdtempSync(join(tmpdir(), "tablegate-html-"));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  async function open(reports: readonly DeliveryReport[], shot?: string) {
    const file = join(dir, `report-${reports.length}.html`);
    writeFileSync(file, html(reports, ctx));
    // A fresh profile per launch; Playwright takes it as launchPersistentContext's first argument.
    const browser = await chromium.launchPersistentContext(mkdtempSync(join(dir, "profile-")), {
      executablePath: CHROMIUM,
      viewport: { width: 1200, height: 900 },
      args: [
        "--headless",
        "--no-sandbox",
        "--disable-gpu",
        "--disable-quic",
        "--no-first-run",
        "--disable-background-networking",
        "--disable-component-update",
        "--disable-sync",
      ],
    });
    try {
      const p = await browser.newPage();
      const console: string[] = [];
      const requests: string[] = [];
      p.on("console", (m) => console.push(`${m.type()}: ${m.text()}`));
      p.on("pageerror", (e) => console.push(`pageerror: ${e.message}`));
      p.on("request", (r) => requests.push(r.url()));
      const url = pathToFileURL(file).href;
      await p.goto(url, { waitUntil: "load" });
      const text = await p.innerText("body");
      const scripts = await p.locator("script").count();
      const marks = await p.locator("mark").allInnerTexts();
      const bars = await p.locator("svg.bars").count();
      const barValues = await p.locator("svg.bars .bar-value").allTextContents();
      const hists = await p.locator("svg.hist").count();
      if (shot !== undefined) {
        mkdirSync("test-artifacts", { recursive: true });
        await p.screenshot({ path: join("test-artifacts", shot), fullPage: true });
      }
      return { text, console, requests: requests.filter((r) => r !== url), scripts, marks, bars, barValues, hists };
    } finally {
      await browser.close();
    }
  }

  test("loads with no console output, no requests, and shows the expected counts", async () => {
    const got = await open([sales, returns], "html-report.png");
    expect(got.console).toEqual([]);
    expect(got.requests).toEqual([]);
    expect(got.text).toContain("1 of 2 deliveries does not meet its contract.");
    expect(got.text).toContain("14 problems in 12 of 5,000 rows (10 errors, 3 warnings, 1 note).");
    expect(got.text).toContain("No problems found in 120 rows.");
    // one bar per failing check, labelled with its exact count
    expect(got.bars).toBe(1);
    expect(got.barValues).toEqual(["3", "2", "1", "1", "1", "1", "1", "2", "1", "1"]);
    // numeric and date columns carry a histogram
    expect(got.hists).toBe(sales.profile?.filter((c) => c.histogram !== undefined).length);
  }, 60_000);

  test("a <script> value stays inert text", async () => {
    const got = await open([sales]);
    expect(got.scripts).toBe(0);
    expect(got.marks).toContain("<script>alert('x')</script> & Summit Outfitters");
    expect(got.console).toEqual([]);
  }, 60_000);
});
