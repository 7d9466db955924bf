import { createRequire } from "node:module";
import { readdirSync } from "node:fs";
import { dirname, join } from "node:path";
import { describe, expect, it } from "vitest";
import { checkPostal, OPERATOR_LAYOUTS, postalLayout } from "../../src/postal/index.js";

const require = createRequire(import.meta.url);
const postalCodes = require("postal-codes-js") as { validate(country: string, code: string): true | string };

const status = (cc: string, code: string): string => checkPostal(cc, code).status;

// Each case: country, codes the operator's format accepts, codes it rejects. Valid codes are the
// operators' own well-known examples (from memory, as noted) or invented codes in the published layout.
const OPERATOR_CASES: readonly [string, string, readonly string[], readonly string[]][] = [
  // USPS Publication 28: ZIP 12345 or ZIP+4 12345-6789. Invalid "1-2-3-4-5" from reference-facts.md.
  ["US", "USPS Publication 28", ["20500", "12345-6789", "00501"], ["1-2-3-4-5", "123456789", "12345 6789", "1234", "12345-678", "2050O"]],
  // Canada Post Canadian Addressing Guide; K1A 0B1 is Canada Post's head office (from memory).
  ["CA", "Canada Post", ["K1A 0B1", "M5V 3L9", "H0H 0H0"], ["K1A0B1", "K1A-0B1", "k1a 0b1", "D1A 0B1", "W1A 1A1", "Z9Z 9Z9", "K1A 0O1"]],
  // Royal Mail PAF / BS 7666 examples as listed in the UK Government Data Standards Catalogue (from
  // memory); QQ1 1QQ and S-W-1-A-1-A-A from reference-facts.md.
  ["GB", "Royal Mail", ["M1 1AA", "M60 1NW", "CR2 6XH", "DN55 1PT", "W1A 1HQ", "EC1A 1BB", "GIR 0AA"], ["QQ1 1QQ", "S-W-1-A-1-A-A", "SW1A1AA", "sw1a 1aa", "EC1A 1CB", "V1 1AA", "AI1 1AA", "W1A  1HQ", "WC2H"]],
  // Deutsche Post: 10117 Berlin, 01067 Dresden (from memory).
  ["DE", "Deutsche Post", ["10117", "01067", "99998"], ["00123", "1011", "D-10117", "10 117", "101170"]],
  // PostNL: 2511 CV The Hague (from memory).
  ["NL", "PostNL", ["2511 CV", "1012 JS"], ["2511CV", "2511 cv", "0123 AB", "1234 SA", "1234 SD", "1234 SS", "1234-AB"]],
  // La Poste: 75008 Paris, 20000 Ajaccio, 97400 Saint-Denis (La Reunion) (from memory).
  ["FR", "La Poste", ["75008", "20000", "97400", "01000"], ["7500", "00100", "75 008", "2A000", "F-75008", "99999"]],
  // Japan Post: 100-0001 Chiyoda, Tokyo (from memory); 1000-001 from reference-facts.md.
  ["JP", "Japan Post", ["100-0001", "1000001"], ["1000-001", "100 0001", "10-00001", "100-001"]],
  // Australia Post: 2000 Sydney, 3000 Melbourne, 0800 Darwin, 2600 Canberra (from memory).
  ["AU", "Australia Post", ["2000", "3000", "0800", "2600"], ["200", "20000", "0100", "A2000"]],
  // Correios: 01310-100 Sao Paulo, 70040-010 Brasilia (from memory).
  ["BR", "Correios", ["01310-100", "70040010"], ["01310 100", "1-2345678", "0131-0100", "01310-10"]],
];

describe("operator layouts", () => {
  it.each(OPERATOR_CASES)("%s (%s): valid and invalid examples", (cc, _source, valid, invalid) => {
    for (const code of valid) expect([code, status(cc, code)]).toEqual([code, "valid"]);
    for (const code of invalid) expect([code, status(cc, code)]).toEqual([code, "invalid"]);
  });

  it("covers at least the nine required countries", () => {
    expect(Object.keys(OPERATOR_LAYOUTS).sort()).toEqual(["AU", "BR", "CA", "DE", "FR", "GB", "JP", "NL", "US"]);
  });

  it("does not inherit postal-codes-js's known defects (reference-facts.md)", () => {
    // The library strips inner separators and accepts these; judged as written, they fail.
    for (const [cc, code] of [["US", "1-2-3-4-5"], ["GB", "S-W-1-A-1-A-A"], ["GB", "QQ1 1QQ"], ["JP", "1000-001"]] as const) {
      expect(postalCodes.validate(cc, code)).toBe(true);
      expect(status(cc, code)).toBe("invalid");
    }
  });

  it("gives the layout as expected text and reuses one verdict per country", () => {
    const a = checkPostal("US", "x");
    expect(a).toEqual({ status: "invalid", expected: postalLayout("US")?.expected });
    expect(checkPostal("US", "y")).toBe(a);
  });
});

describe("layouts from postal-codes-js", () => {
  it("judges digit layouts as written: no stripped dashes or spaces", () => {
    // postal-codes-js: PL is NN-NNN with the hyphen, AT is four digits (formats/PL.json, 4Digits.json).
    expect(status("PL", "44-100")).toBe("valid");
    expect(status("PL", "44100")).toBe("invalid");
    expect(status("AT", "1010")).toBe("valid");
    expect(status("AT", "1-010")).toBe("invalid");
    expect(status("AT", "10 10")).toBe("invalid");
    expect(postalCodes.validate("AT", "1-010")).toBe(true);
  });

  it("gives US territories that use ZIP codes the USPS layout", () => {
    // USPS Publication 28: PR, VI, GU and the other territories use ZIP codes (from memory).
    expect(status("PR", "00901")).toBe("valid");
    expect(status("PR", "00901-1234")).toBe("valid");
    expect(status("PR", "0-0-9-0-1")).toBe("invalid");
  });

  it("puts a separator back only where the layout has it", () => {
    expect(status("GG", "GY1 1AA")).toBe("valid");
    expect(status("GG", "GY11AA")).toBe("valid");
    expect(status("GG", "G-Y11AA")).toBe("invalid");
    expect(status("LT", "LT-12345")).toBe("valid");
    expect(status("LT", "1-2345")).toBe("invalid");
    expect(status("KY", "KY1-1234")).toBe("valid");
    expect(status("KY", "KY11-234")).toBe("invalid");
  });

  it("accepts postal-codes-js's own valid examples as it writes them, upper case, for every country it judges", () => {
    // Outside check: the TestData.Valid lists shipped in postal-codes-js formats/*.json, for countries
    // without an operator layout. Lower-case examples are left out (layouts are judged in capitals),
    // as is PL's "44-100 " (a trailing space, which the check trims before judging), and DK/LU prefixes
    // written with a space ("DK 1125", "DK - 1234"): the library strips those; the layout is DK-1234.
    const separatorForms = new Set(["DK 1125", "DK - 1234", "L 1125", "L - 1234"]);
    const formats = join(dirname(require.resolve("postal-codes-js")), "formats");
    const byAlpha2 = require("postal-codes-js/generated/postal-codes-alpha2.json") as Record<string, { postalCodeFormat?: string }>;
    let checked = 0;
    for (const [cc, entry] of Object.entries(byAlpha2)) {
      if (!entry.postalCodeFormat || cc in OPERATOR_LAYOUTS) continue;
      const file = join(formats, entry.postalCodeFormat);
      const examples = (require(file) as { TestData?: { Valid?: string[] } }).TestData?.Valid ?? [];
      for (const code of examples) {
        if (code !== code.toUpperCase() || code !== code.trim() || separatorForms.has(code)) continue;
        expect([cc, code, status(cc, code)]).toEqual([cc, code, "valid"]);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(100);
    expect(readdirSync(formats).length).toBeGreaterThan(60);
  });
});

describe("countries without a layout", () => {
  it("gives unknown with a note, never a silent pass", () => {
    // postal-codes-js lists AE with no format and accepts anything for it.
    expect(postalCodes.validate("AE", "anything")).toBe(true);
    expect(checkPostal("AE", "anything")).toEqual({ status: "unknown", expected: "no postal layout known for AE" });
    expect(status("ZZ", "12345")).toBe("unknown");
    expect(status("us", "12345")).toBe("unknown");
    expect(status("__proto__", "1")).toBe("unknown");
    expect(status("", "1")).toBe("unknown");
  });
});
