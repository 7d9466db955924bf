import { createRequire } from "node:module";
import { sha256Hex } from "./csv-table.js";
import { makeRefTable, type RefTable } from "./ref-table.js";

interface CountriesModule {
  getAlpha2Codes(): Record<string, string>;
  alpha2ToAlpha3(code: string): string | undefined;
  alpha2ToNumeric(code: string): string | undefined;
  getName(code: string, lang: string): string | undefined;
  registerLocale(locale: object): void;
}

/** Codes in i18n-iso-countries that ISO 3166-1 does not assign (XK, Kosovo, is a user-assigned code). */
const NOT_ISO = new Set(["XK"]);

/** One CSV field per RFC 4180: quoted only when it holds a comma, quote or line break. */
function csvField(v: string): string {
  return /[",\r\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v;
}

/** The iso-3166-1 rows (sorted by alpha2) and the canonical CSV they hash as: RFC 4180, CRLF line ends. */
export function iso3166Data(): { rows: string[][]; csv: string; version: string } {
  const require = createRequire(import.meta.url);
  // The library's core and its English names only: its Node entry registers all 80-odd languages,
  // about 50 ms of every run's start for names no table uses.
  const countries = require("i18n-iso-countries/index.js") as CountriesModule;
  countries.registerLocale(require("i18n-iso-countries/langs/en.json") as object);
  const pkg = require("i18n-iso-countries/package.json") as { version: string };
  const rows: string[][] = [];
  for (const a2 of Object.keys(countries.getAlpha2Codes()).sort()) {
    if (NOT_ISO.has(a2)) continue;
    rows.push([a2, countries.alpha2ToAlpha3(a2) ?? "", countries.alpha2ToNumeric(a2) ?? "", countries.getName(a2, "en") ?? ""]);
  }
  const csv = [COLUMNS, ...rows].map((r) => r.map(csvField).join(",")).join("\r\n") + "\r\n";
  return { rows, csv, version: `i18n-iso-countries ${pkg.version}` };
}

const COLUMNS = ["alpha2", "alpha3", "numeric", "name"];

let alpha2Codes: ReadonlySet<string> | undefined;

/** True when `code` is an ISO 3166-1 alpha-2 code of the built-in table (so `UK` and `XK` are not). */
export function isIsoAlpha2(code: string): boolean {
  alpha2Codes ??= new Set(iso3166Data().rows.map((r) => r[0] as string));
  return alpha2Codes.has(code);
}

/** The built-in iso-3166-1 table (alpha2, alpha3, numeric as three-digit text, English name). */
export function iso3166Table(): RefTable {
  const { rows, csv, version } = iso3166Data();
  return makeRefTable(
    {
      name: "iso-3166-1",
      version,
      source: "ISO 3166-1 country codes as published in the i18n-iso-countries package",
      description: "Countries by ISO 3166-1 alpha-2, alpha-3 and numeric code (three digits, as text), with the English name. XK (Kosovo) is left out: it is a user-assigned code, not part of ISO 3166-1.",
      file: "(built-in)/iso-3166-1",
      builtIn: true,
      origin: "(built-in)",
      key: "alpha2",
      columns: COLUMNS,
      types: ["text", "text", "text", "text"],
      sha256: sha256Hex(new TextEncoder().encode(csv)),
    },
    rows,
  );
}
