import type { CheckTally, DeliveryReport, Finding } from "../../src/report/model.js";
import type { WriterContext } from "../../src/report/writer.js";

// Invented data: a fictional outdoor-gear wholesaler's weekly dealer sales and returns.

export const ctx: WriterContext = { root: "/srv/repo", toolVersion: "0.1.0" };

const sha = (c: string): string => c.repeat(64);

const salesFindings: Finding[] = [
  { rule: "header.unexpected", level: "note", line: 1, column: "promo_code", value: "promo_code", message: "column promo_code is not in the contract" },
  { rule: "discount.max", level: "error", row: 17, line: 18, column: "discount", value: "0.9", expected: "<= 0.6", message: "discount 0.9 is above the maximum 0.6" },
  { rule: "sku.pattern", level: "error", row: 42, line: 43, column: "sku", value: "TRL-441O", expected: "^[A-Z]{3}-[0-9]{4}$", message: "sku TRL-441O does not match the pattern" },
  { rule: "discount.max", level: "error", row: 230, line: 231, column: "discount", value: "0.75", expected: "<= 0.6", message: "discount 0.75 is above the maximum 0.6" },
  { rule: "rule:ship-after-invoice", level: "error", row: 311, line: 312, value: "ship_date=2026-11-20, invoice_date=2026-11-24", message: "Goods cannot ship before they are invoiced." },
  { rule: "contact.format", level: "error", row: 512, line: 514, column: "contact", value: "d***@***.example", expected: "email", message: "contact is not an email address" },
  { rule: "dealer_name.max_length", level: "error", row: 777, line: 779, column: "dealer_name", value: "<script>alert('x')</script> & Summit Outfitters", expected: "<= 40 characters", message: "dealer_name is longer than 40 characters" },
  { rule: "key:invoice_no+line_no", level: "error", row: 1204, line: 1206, column: "invoice_no+line_no", value: "INV-0048213+2", message: "duplicate key INV-0048213+2, first seen at row 1203" },
  { rule: "outlier:unit_price", level: "warning", row: 1530, line: 1532, column: "unit_price", value: "18999.00", expected: "<= 742.50", message: "unit_price 18999.00 lies far above the usual range" },
  { rule: "notes.spaces", level: "warning", row: 2048, line: 2050, column: "notes", value: " 50%, rush: call\r\nback ", message: "notes has leading or trailing spaces" },
  { rule: "discount.max", level: "error", row: 4102, line: 4104, column: "discount", value: "0.65", expected: "<= 0.6", message: "discount 0.65 is above the maximum 0.6" },
  { rule: "outlier:unit_price", level: "warning", row: 4390, line: 4392, column: "unit_price", value: "18999.00", expected: "<= 742.50", message: "unit_price 18999.00 lies far above the usual range" },
  { rule: "sku.pattern", level: "error", row: 4711, line: 4713, column: "sku", value: "CMP-12\u0007", expected: "^[A-Z]{3}-[0-9]{4}$", message: "sku CMP-12\u0007 does not match the pattern" },
  { rule: "group:invoice-total", level: "error", value: "INV-0048377", expected: "sum(line_total) = first(invoice_total)", message: "invoice INV-0048377: lines sum to 1204.50 but the total says 1240.50" },
];

const salesChecks: CheckTally[] = [
  { rule: "header.unexpected", level: "note", failed: 1, description: "the header lists only the declared columns", source: { line: 9, column: 3 } },
  { rule: "sku.pattern", level: "error", failed: 2, description: "sku matches ^[A-Z]{3}-[0-9]{4}$", source: { line: 16, column: 8 } },
  { rule: "dealer_name.max_length", level: "error", failed: 1, description: "dealer_name at most 40 characters", source: { line: 17, column: 16 } },
  { rule: "qty.min", level: "error", failed: 0, description: "qty at least 1", source: { line: 20, column: 16 } },
  { rule: "discount.max", level: "error", failed: 3, description: "discount at most 0.6", source: { line: 22, column: 16 } },
  { rule: "contact.format", level: "error", failed: 1, description: "contact is an email address", source: { line: 23, column: 16 } },
  { rule: "notes.spaces", level: "warning", failed: 1, description: "notes has no leading or trailing spaces", source: { line: 24, column: 3 } },
  { rule: "key:invoice_no+line_no", level: "error", failed: 1, description: "invoice_no + line_no is unique", source: { line: 26, column: 5 } },
  { rule: "rule:ship-after-invoice", level: "error", failed: 1, description: "ship_date >= invoice_date: Goods cannot ship before they are invoiced.", source: { line: 29, column: 5 } },
  { rule: "group:invoice-total", level: "error", failed: 1, description: "per invoice_no: sum(line_total) = first(invoice_total)", source: { line: 34, column: 5 } },
  { rule: "totals.rows", level: "error", failed: 0, description: "between 1 and 2,000,000 rows", source: { line: 38, column: 3 } },
  { rule: "totals.blank_share.discount", level: "error", failed: 0, description: "discount blank in at most 20% of rows", source: { line: 39, column: 16 } },
  { rule: "outlier:unit_price", level: "warning", failed: 2, description: "unit_price inside Tukey fences with k = 3", source: { line: 41, column: 5 }, allow: 0.001, share: 0.0004, within_allowance: true },
];

/** A failing weekly sales delivery with one finding of most kinds, awkward values included. */
export const sales: DeliveryReport = {
  report: 1,
  tool: { name: "tablegate", version: "0.1.0" },
  contract: { name: "dealer-sales", version: "1.4.0", path: "contracts/dealer-sales.contract.yaml", sha256: sha("a") },
  input: { path: "deliveries/dealer-sales/w48.csv", sha256: sha("b"), bytes: 612_480, rows: 5000, format: "csv", encoding: "utf-8" },
  references: [
    { table: "iso-3166-1", version: "7.14.0", sha256: sha("c") },
    { table: "us-states", version: "2026.1", sha256: sha("d") },
  ],
  verdict: "fail",
  counts: { error: 10, warning: 3, note: 1, rows_failed: 12 },
  checks: salesChecks,
  findings: salesFindings,
  truncated: false,
  profile: [
    { column: "invoice_no", type: "text", filled: 5000, blank: 0, distinct: 1412, distinct_capped: false, min: "INV-0048001", max: "INV-0049412" },
    { column: "line_no", type: "integer", filled: 5000, blank: 0, distinct: 9, distinct_capped: false, min: "1", max: "9", histogram: [1412, 1208, 903, 611, 402, 250, 130, 60, 24] },
    { column: "invoice_date", type: "date", filled: 5000, blank: 0, distinct: 7, distinct_capped: false, min: "2026-11-23", max: "2026-11-29", histogram: [802, 790, 811, 760, 744, 700, 393] },
    { column: "sku", type: "text", filled: 5000, blank: 0, distinct: 318, distinct_capped: false, min: "BAG-2210", max: "TRL-4410" },
    { column: "dealer_name", type: "text", filled: 4990, blank: 10, distinct: 86, distinct_capped: false, min: "Alder Creek Supply", max: "Zephyr Trail Co." },
    { column: "qty", type: "integer", filled: 5000, blank: 0, distinct: 64, distinct_capped: false, min: "1", max: "240", histogram: [3100, 1200, 400, 180, 70, 30, 12, 5, 2, 1] },
    { column: "unit_price", type: "decimal", filled: 5000, blank: 0, distinct: 402, distinct_capped: false, min: "3.50", max: "18999.00", histogram: [4998, 0, 0, 0, 0, 0, 0, 0, 0, 2] },
    { column: "discount", type: "decimal", filled: 4410, blank: 590, distinct: 14, distinct_capped: false, min: "0", max: "0.9", histogram: [2100, 1300, 700, 240, 60, 7, 0, 2, 0, 1] },
    { column: "contact", type: "text", filled: 4875, blank: 125, distinct: 86, distinct_capped: false },
    { column: "notes", type: "text", filled: 312, blank: 4688, distinct: 10000, distinct_capped: true, min: " 50%, rush", max: "wrap in tarp" },
  ],
  elapsed_ms: 182,
};

/** A clean returns delivery checked in the same run against another contract. */
export const returns: DeliveryReport = {
  report: 1,
  tool: { name: "tablegate", version: "0.1.0" },
  contract: { name: "dealer-returns", path: "contracts/dealer-returns.contract.yaml", sha256: sha("e") },
  input: { path: "deliveries/returns/w48.csv", sha256: sha("f"), bytes: 8_120, rows: 120, format: "csv", encoding: "utf-8" },
  references: [],
  verdict: "pass",
  counts: { error: 0, warning: 0, note: 0, rows_failed: 0 },
  checks: [
    { rule: "rma_no.pattern", level: "error", failed: 0, description: "rma_no matches ^RMA-[0-9]{6}$", source: { line: 12, column: 11 } },
    { rule: "reason.codes", level: "error", failed: 0, description: "reason is one of DAMAGED, WRONG_ITEM, UNWANTED", source: { line: 14, column: 11 } },
  ],
  findings: [],
  truncated: false,
  elapsed_ms: 4,
};

/**
 * A delivery with `n` findings of rule `qty.max` at error level and `w` at warning level, the
 * warnings first, so caps that keep the most severe have to reorder.
 */
export function bulk(n: number, w = 0, truncatedTo?: number): DeliveryReport {
  const findings: Finding[] = [];
  for (let i = 0; i < w; i++) {
    findings.push({ rule: "unit_price.scale", level: "warning", row: i + 1, line: i + 2, column: "unit_price", value: `${i}.125`, expected: "scale 2", message: "unit_price has more than 2 decimals" });
  }
  for (let i = 0; i < n; i++) {
    findings.push({ rule: "qty.max", level: "error", row: w + i + 1, line: w + i + 2, column: "qty", value: String(10001 + i), expected: "<= 10000", message: "qty is above the maximum 10000" });
  }
  const kept = truncatedTo === undefined ? findings : findings.slice(0, truncatedTo);
  return {
    report: 1,
    tool: { name: "tablegate", version: "0.1.0" },
    contract: { name: "dealer-sales", version: "1.4.0", path: "contracts/dealer-sales.contract.yaml", sha256: sha("a") },
    input: { path: "deliveries/dealer-sales/bulk.csv", sha256: sha("9"), bytes: 1_000_000, rows: n + w, format: "csv", encoding: "utf-8" },
    references: [],
    verdict: n > 0 ? "fail" : "pass",
    counts: { error: n, warning: w, note: 0, rows_failed: n + w },
    checks: [
      { rule: "unit_price.scale", level: "warning", failed: w, description: "unit_price has at most 2 decimals", source: { line: 21, column: 16 } },
      { rule: "qty.max", level: "error", failed: n, description: "qty at most 10000", source: { line: 20, column: 16 } },
    ],
    findings: kept,
    truncated: kept.length < findings.length,
  };
}
