/** What one check should report on a demo delivery: how many failures, on which rows, and why. */
export interface ExpectedFailure {
  readonly failed: number;
  /** Data-record numbers (from 1) of the findings, when they point at rows. */
  readonly rows?: readonly number[];
  /** The problem planted in the sample, in a few words. */
  readonly planted: string;
}

/** The designed outcome of checking one demo delivery. */
export interface DeliveryOutcome {
  readonly file: string;
  readonly exitCode: 0 | 1;
  readonly verdict: "pass" | "fail";
  readonly rows: number;
  /** Every check expected to fail, by rule id; any other failing check is a difference. */
  readonly failures: Readonly<Record<string, ExpectedFailure>>;
}

export const CONTRACT = "contracts/dealer-sales.contract.yaml";

/** Week 48: the problems planted in contracts/samples/dealer-sales-w48.csv. */
export const WEEK_48: DeliveryOutcome = {
  file: "contracts/samples/dealer-sales-w48.csv",
  exitCode: 1,
  verdict: "fail",
  rows: 39,
  failures: {
    "contact.format": { failed: 1, rows: [2], planted: "two e-mail addresses in one cell (shown masked)" },
    "sku.spaces": { failed: 1, rows: [7], planted: "a leading space before a SKU" },
    "key:invoice_no+line_no": { failed: 1, rows: [12], planted: "an invoice line sent twice" },
    duplicates: { failed: 1, rows: [12], planted: "the same line repeated exactly" },
    "qty.type": { failed: 1, rows: [15], planted: "quantity written as \"12 pcs\"" },
    "outlier:unit_price": { failed: 1, rows: [19], planted: "48.99 exported as 4899.00" },
    "category.required": { failed: 1, rows: [23], planted: "a blank product category" },
    "rule:net-amount": { failed: 1, rows: [25], planted: "net amount without its 25% discount" },
    "rule:region-matches-state": { failed: 2, rows: [26, 33], planted: "a Texas line in region WEST; NORTH EAST for Vermont" },
    "rule:ship-after-invoice": { failed: 1, rows: [30], planted: "shipped ten days before it was invoiced" },
    "ship_date.type": { failed: 1, rows: [32], planted: "November 31st" },
    "sales_region.codes": { failed: 1, rows: [33], planted: "region spelt \"NORTH EAST\"" },
    "group:invoice-lines": { failed: 2, planted: "invoice lines 1, 2, 4 (line 3 dropped); the repeated line" },
  },
};

/** Week 47: a clean delivery. */
export const WEEK_47: DeliveryOutcome = {
  file: "contracts/samples/dealer-sales-w47.csv",
  exitCode: 0,
  verdict: "pass",
  rows: 27,
  failures: {},
};

/** Report formats the demo writes, with the file name each goes to (SPEC §3). */
export const REPORT_FILES: Readonly<Record<string, string>> = {
  json: "w48.json",
  text: "w48.txt",
  sarif: "w48.sarif",
  junit: "w48.junit.xml",
  github: "w48.github.txt",
  codequality: "w48.codequality.json",
  html: "w48.html",
};
