import { createWriteStream } from "node:fs";
import { mkdtemp } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
import { mulberry32 } from "./prng.js";

/** The header of contracts/dealer-sales.contract.yaml, in file order. */
export const HEADER =
  "invoice_no,line_no,invoice_date,ship_date,dealer_id,country,state,postal_code,sales_region,sku,category,qty,unit_price,discount,net_amount,contact";

/** Problems the generator plants, each named by the rule id the demo contract should report for it. */
export const PROBLEM_KINDS = [
  "sku.spaces",
  "qty.type",
  "category.required",
  "sales_region.codes",
  "ship_date.type",
  "rule:ship-after-invoice",
  "rule:net-amount",
  "outlier:unit_price",
  "duplicates",
  "rule:region-matches-state",
] as const;
export type ProblemKind = (typeof PROBLEM_KINDS)[number];

export interface GenerateOptions {
  readonly rows: number;
  readonly seed?: number;
  /** Share of rows that carry one planted problem (default 0.001). */
  readonly problemShare?: number;
  /** Output file; default a new folder under os.tmpdir(). */
  readonly path?: string;
}

export interface GenerateResult {
  readonly path: string;
  readonly rows: number;
  readonly bytes: number;
  /** How many rows carry each planted problem. */
  readonly planted: Readonly<Record<ProblemKind, number>>;
}

// Census regions of the states used here (U.S. Census Bureau regions, as in reference/builtin/us-states.csv).
const US_STATES: readonly (readonly [state: string, region: string, zip: string])[] = [
  ["CO", "WEST", "80"], ["VT", "NORTHEAST", "05"], ["NC", "SOUTH", "28"], ["MN", "MIDWEST", "55"],
  ["OR", "WEST", "97"], ["TX", "SOUTH", "78"], ["ME", "NORTHEAST", "04"], ["WA", "WEST", "98"],
  ["UT", "WEST", "84"], ["MI", "MIDWEST", "49"], ["WI", "MIDWEST", "54"], ["TN", "SOUTH", "37"],
  ["GA", "SOUTH", "30"], ["NY", "NORTHEAST", "12"], ["PA", "NORTHEAST", "16"], ["MT", "WEST", "59"],
];
const CA_PROVINCES: readonly (readonly [province: string, fsaLetter: string])[] = [["BC", "V"], ["AB", "T"], ["ON", "K"], ["QC", "H"]];
// Codes of reference/product-categories.csv with a price band in cents; REPAIR skus use the prefix RPR.
const CATEGORIES: readonly (readonly [code: string, prefix: string, low: number, high: number])[] = [
  ["TENT", "TENT", 18900, 54900], ["SLEEP", "SLEEP", 8900, 23900], ["STOVE", "STOVE", 3995, 11900],
  ["PACK", "PACK", 14900, 27900], ["DAYPK", "DAYPK", 4900, 8900], ["BOOT", "BOOT", 14900, 21900],
  ["TRAIL", "TRAIL", 11900, 15900], ["JACKT", "JACKT", 17900, 32900], ["LAYER", "LAYER", 3900, 8900],
  ["MAPS", "MAPS", 1295, 2495], ["REPAIR", "RPR", 850, 1995], ["GIFT", "GIFT", 2500, 10000],
];
const DISCOUNTS = [5, 10, 15, 20, 25] as const;
const LETTERS = "ABCEGHJKLMNPRSTVWXYZ";
const FIRST_INVOICE_DAY = Date.UTC(2026, 10, 23) / 86_400_000; // Monday of week 48, 2026
const SERIAL_EPOCH_DAY = Date.UTC(1899, 11, 30) / 86_400_000; // day 0 of spreadsheet serial-1900 dates
const CHUNK_ROWS = 4096;

interface Dealer { readonly id: string; readonly place: string; readonly region: string; readonly contact: string; readonly us: boolean; readonly state: string }
interface Item { readonly sku: string; readonly category: string; readonly cents: number }

function pick<T>(rand: () => number, list: readonly T[]): T {
  return list[Math.floor(rand() * list.length)] as T;
}

function digits(rand: () => number, n: number): string {
  let s = "";
  for (let i = 0; i < n; i++) s += Math.floor(rand() * 10);
  return s;
}

function makeDealers(rand: () => number): Dealer[] {
  const dealers: Dealer[] = [];
  for (let i = 0; i < 48; i++) {
    const id = `D-${1000 + i * 37}`;
    const contact = `orders@d${1000 + i * 37}.example.${i % 2 === 0 ? "org" : "com"}`;
    if (i % 6 === 5) {
      const [province, letter] = pick(rand, CA_PROVINCES);
      const postal = `${letter}${digits(rand, 1)}${pick(rand, [...LETTERS])} ${digits(rand, 1)}${pick(rand, [...LETTERS])}${digits(rand, 1)}`;
      dealers.push({ id, place: `CA,${province},${postal}`, region: "CANADA", contact, us: false, state: province });
    } else {
      const [state, region, zip] = pick(rand, US_STATES);
      dealers.push({ id, place: `US,${state},${zip}${digits(rand, 3)}`, region, contact, us: true, state });
    }
  }
  return dealers;
}

function makeItems(rand: () => number): Item[] {
  const items: Item[] = [];
  for (const [category, prefix, low, high] of CATEGORIES) {
    for (let i = 0; i < 8; i++) {
      const cents = Math.round((low + rand() * (high - low)) / 5) * 5;
      items.push({ sku: `${prefix}-${1000 + Math.floor(rand() * 9000)}-${pick(rand, ["BK", "GR", "OR", "S", "M", "L", "01", "02"])}`, category, cents });
    }
  }
  return items;
}

const isoDays = new Map<number, string>();

// Few distinct days occur, so the text of each is built once.
function isoDay(day: number): string {
  let text = isoDays.get(day);
  if (text === undefined) {
    text = new Date(day * 86_400_000).toISOString().slice(0, 10);
    isoDays.set(day, text);
  }
  return text;
}

function usDay(day: number): string {
  const d = new Date(day * 86_400_000);
  return `${String(d.getUTCMonth() + 1).padStart(2, "0")}/${String(d.getUTCDate()).padStart(2, "0")}/${d.getUTCFullYear()}`;
}

function money(cents: number): string {
  const whole = Math.trunc(cents / 100);
  const rest = cents - whole * 100;
  return `${whole}.${rest < 10 ? "0" : ""}${rest}`;
}

function emptyCounts(): Record<ProblemKind, number> {
  const counts = {} as Record<ProblemKind, number>;
  for (const k of PROBLEM_KINDS) counts[k] = 0;
  return counts;
}

/** Yield the delivery's text in chunks of whole lines: the header, then exactly `rows` data records. */
export function* deliveryChunks(options: GenerateOptions, planted: Record<ProblemKind, number>): Generator<string> {
  const rand = mulberry32(options.seed ?? 20261123);
  const share = options.problemShare ?? 0.001;
  const dealers = makeDealers(rand);
  const items = makeItems(rand);
  const wrongRegion: Readonly<Record<string, string>> = { WEST: "SOUTH", SOUTH: "MIDWEST", MIDWEST: "NORTHEAST", NORTHEAST: "WEST" };

  let invoice = 2_600_000;
  let line = 0;
  let linesInInvoice = 0;
  let head = ""; // columns shared by the lines of the current invoice, up to sales_region
  let dealer = dealers[0] as Dealer;
  let invoiceDay = FIRST_INVOICE_DAY;
  let shipText = "";
  let previous = "";
  let previousProblem: ProblemKind | undefined;
  let chunk: string[] = [HEADER];
  for (let row = 0; row < options.rows; row++) {
    if (line === linesInInvoice) {
      invoice++;
      line = 0;
      linesInInvoice = 1 + Math.floor(rand() * 6);
      dealer = pick(rand, dealers);
      invoiceDay = FIRST_INVOICE_DAY + Math.floor(rand() * 7);
      const shipDay = invoiceDay + Math.floor(rand() * 5);
      const f = rand();
      shipText = f < 0.8 ? isoDay(shipDay) : f < 0.95 ? usDay(shipDay) : String(shipDay - SERIAL_EPOCH_DAY);
      head = `INV-${invoice},`;
    }
    line++;
    let problem: ProblemKind | undefined = rand() < share ? pick(rand, PROBLEM_KINDS) : undefined;
    // Only a clean row is repeated, and only a US row can contradict its state's region, so that
    // each planted problem stands for exactly one failure of its check.
    if ((problem === "duplicates" && (previous === "" || previousProblem !== undefined)) || (problem === "rule:region-matches-state" && !dealer.us)) problem = undefined;
    let text: string;
    if (problem === "duplicates") {
      text = previous; // the same record twice, so its invoice gets one line more than its numbering says
      line--;
    } else {
      const item = pick(rand, items);
      const qty = 1 + Math.floor(rand() * rand() * 24);
      const discount = rand() < 0.55 ? 0 : pick(rand, DISCOUNTS);
      let cents = item.cents;
      if (problem === "outlier:unit_price") cents = Math.max(cents * 100, 200_000);
      let net = Math.round((qty * cents * (100 - discount)) / 100);
      if (problem === "rule:net-amount") net += 1000;
      const ship =
        problem === "ship_date.type" ? "2026-11-31"
        : problem === "rule:ship-after-invoice" ? isoDay(invoiceDay - 3)
        : shipText;
      const region =
        problem === "sales_region.codes" ? (dealer.us ? "NORTH EAST" : "PACIFIC")
        : problem === "rule:region-matches-state" ? (wrongRegion[dealer.region] ?? dealer.region)
        : dealer.region;
      const sku = problem === "sku.spaces" ? ` ${item.sku}` : item.sku;
      const category = problem === "category.required" ? "" : item.category;
      const qtyText = problem === "qty.type" ? `${qty} pcs` : String(qty);
      text =
        `${head}${line},${isoDay(invoiceDay)},${ship},${dealer.id},${dealer.place},${region},${sku},${category},` +
        `${qtyText},${money(cents)},${discount === 0 ? "" : `0.${String(discount).padStart(2, "0")}`},${money(net)},${dealer.contact}`;
    }
    if (problem !== undefined) planted[problem]++;
    previous = text;
    previousProblem = problem;
    chunk.push(text);
    if (chunk.length >= CHUNK_ROWS) {
      yield chunk.join("\n") + "\n";
      chunk = [];
    }
  }
  if (chunk.length > 0) yield chunk.join("\n") + "\n";
}

/** Write a deterministic delivery for the demo contract; resolves once the file is flushed. */
export async function generateDelivery(options: GenerateOptions): Promise<GenerateResult> {
  const path = options.path ?? join(await mkdtemp(join(tmpdir(), "tablegate-bench-")), `dealer-sales-${options.rows}.csv`);
  const planted = emptyCounts();
  const out = createWriteStream(path);
  const failed = new Promise<never>((_, reject) => out.once("error", reject));
  failed.catch(() => undefined);
  for (const text of deliveryChunks(options, planted)) {
    if (!out.write(text)) await Promise.race([new Promise<void>((resolve) => out.once("drain", () => resolve())), failed]);
  }
  await Promise.race([new Promise<void>((resolve) => out.end(() => resolve())), failed]);
  return { path, rows: options.rows, bytes: out.bytesWritten, planted };
}

function parseRows(argv: readonly string[]): number {
  const at = argv.indexOf("--rows");
  const text = at >= 0 ? argv[at + 1] : undefined;
  const rows = text === undefined ? 1_000_000 : Number(text);
  if (!Number.isInteger(rows) || rows < 1) throw new Error(`--rows expects a positive whole number, got ${String(text)}`);
  return rows;
}

if (process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const result = await generateDelivery({ rows: parseRows(process.argv.slice(2)) });
  process.stdout.write(`${JSON.stringify(result)}\n`);
}
