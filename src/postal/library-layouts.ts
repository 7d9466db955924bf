import { createRequire } from "node:module";
import type { PostalLayout } from "./layout.js";
import { OPERATOR_LAYOUTS } from "./operator-layouts.js";

interface CountryEntry {
  readonly postalCodeFormat?: string;
}

interface FormatFile {
  readonly Description?: string;
  readonly ValidationRegex: string | readonly string[];
}

/**
 * postal-codes-js strips every space and dash before matching, so its patterns describe codes without
 * separators. Where a country's layout has one (per that library's own description and examples), the
 * pattern below puts it back in its one place, optional as the library's examples show it both ways.
 */
const WRITTEN: Readonly<Record<string, { pattern: RegExp; layout: string }>> = {
  AI: { pattern: /^AI-?2640$/, layout: "AI-2640" },
  AQ: { pattern: /^BIQQ ?1ZZ$/, layout: "BIQQ 1ZZ" },
  AX: { pattern: /^(?:AX-?)?[0-9]{5}$/, layout: "12345 or AX-12345" },
  AZ: { pattern: /^AZ-?[0-9]{4}$/, layout: "AZ-1234" },
  DK: { pattern: /^(?:DK-?)?[0-9]{4}$/, layout: "1234 or DK-1234" },
  FK: { pattern: /^FIQQ ?1ZZ$/, layout: "FIQQ 1ZZ" },
  GG: { pattern: /^GY[0-9]{1,2} ?[0-9][A-Z]{2}$/, layout: "GY1 1AA" },
  GI: { pattern: /^GX11 ?1AA$/, layout: "GX11 1AA" },
  GS: { pattern: /^SIQQ ?1ZZ$/, layout: "SIQQ 1ZZ" },
  IM: { pattern: /^IM[0-9]{1,2} ?[0-9][A-Z]{2}$/, layout: "IM1 1AA" },
  IO: { pattern: /^BBND ?1ZZ$/, layout: "BBND 1ZZ" },
  JE: { pattern: /^JE[0-9]{1,2} ?[0-9][A-Z]{2}$/, layout: "JE1 1AA" },
  KY: { pattern: /^KY[0-9]-?[0-9]{4}$/, layout: "KY1-1234" },
  LB: { pattern: /^[0-9]{4}(?: ?[0-9]{4})?$/, layout: "1234 or 1234 5678" },
  LC: { pattern: /^LC[0-9]{2} ?[0-9]{3}$/, layout: "LC12 345" },
  LT: { pattern: /^(?:LT-?)?[0-9]{5}$/, layout: "12345 or LT-12345" },
  LU: { pattern: /^(?:L-?)?[0-9]{4}$/, layout: "1234 or L-1234" },
  LV: { pattern: /^(?:LV-?)?[0-9]{4}$/, layout: "1234 or LV-1234" },
  MD: { pattern: /^(?:MD-?)?[0-9]{4}$/, layout: "1234 or MD-1234" },
  MS: { pattern: /^(?:MSR ?)?[0-9]{4}$/, layout: "MSR 1234" },
  MT: { pattern: /^[A-Z]{3} ?[0-9]{4}$/, layout: "ABC 1234" },
  PN: { pattern: /^PCRN ?1ZZ$/, layout: "PCRN 1ZZ" },
  SH: { pattern: /^STHL ?1ZZ$/, layout: "STHL 1ZZ" },
  SO: { pattern: /^[A-Z]{2} ?[0-9]{5}$/, layout: "AB 12345" },
  TC: { pattern: /^TKCA ?1ZZ$/, layout: "TKCA 1ZZ" },
  TW: { pattern: /^[0-9]{3}(?:-?[0-9]{2})?$/, layout: "123 or 123-45" },
  VC: { pattern: /^(?:VC-?)?[0-9]{4}$/, layout: "1234 or VC-1234" },
  VE: { pattern: /^[0-9]{4}(?:-?[A-Z])?$/, layout: "1234 or 1234-A" },
  VG: { pattern: /^(?:VG-?)?[0-9]{4}$/, layout: "1234 or VG-1234" },
  WS: { pattern: /^(?:WS-?)?[0-9]{4}$/, layout: "1234 or WS-1234" },
};

const require = createRequire(import.meta.url);
let countries: Readonly<Record<string, CountryEntry>> | undefined;

function countryData(): Readonly<Record<string, CountryEntry>> {
  countries ??= require("postal-codes-js/generated/postal-codes-alpha2.json") as Record<string, CountryEntry>;
  return countries;
}

/** The layout postal-codes-js knows for a country, judged as written; undefined when it knows none. */
export function libraryLayout(alpha2: string): PostalLayout | undefined {
  const data = countryData();
  if (!Object.hasOwn(data, alpha2)) return undefined;
  const formatFile = data[alpha2]?.postalCodeFormat;
  if (!formatFile) return undefined;
  const written = WRITTEN[alpha2];
  if (written) return { pattern: written.pattern, expected: `${alpha2} postal code as ${written.layout}` };
  // The US territories and freely associated states use USPS ZIP codes (USPS Publication 28); the
  // library gives them the US format file, so they get the USPS layout too.
  if (formatFile === "US.json" && OPERATOR_LAYOUTS.US) return { pattern: OPERATOR_LAYOUTS.US.pattern, expected: `${alpha2} postal code as 12345 or 12345-6789` };
  const format = require(`postal-codes-js/formats/${formatFile}`) as FormatFile;
  const digits = /^([0-9]+)Digits\.json$/.exec(formatFile);
  if (digits) return { pattern: new RegExp(`^[0-9]{${digits[1]}}$`), expected: `${alpha2} postal code as ${digits[1]} digits` };
  const source = Array.isArray(format.ValidationRegex) ? `^(?:${format.ValidationRegex.join("|")})$` : String(format.ValidationRegex);
  const described = format.Description?.split(" : ")[1];
  // The library's own patterns, matched case-sensitively and without stripping anything.
  return { pattern: new RegExp(source), expected: `${alpha2} postal code as ${described ?? source}` };
}

/** Countries postal-codes-js lists, with or without a layout. */
export function libraryCountries(): readonly string[] {
  return Object.keys(countryData());
}
