import type { PostalLayout } from "./layout.js";

/**
 * Layouts taken from the postal operators' published formats, stricter than postal-codes-js: the code
 * is judged as written (separators only where the operator puts them, capital letters).
 */
export const OPERATOR_LAYOUTS: Readonly<Record<string, PostalLayout>> = {
  // USPS Publication 28, Postal Addressing Standards: 5-digit ZIP Code, or ZIP+4 written with a hyphen.
  US: { pattern: /^[0-9]{5}(?:-[0-9]{4})?$/, expected: "US ZIP code as 12345 or 12345-6789" },
  // Canada Post, Canadian Addressing Guide: ANA NAN with one space; D F I O Q U never used, W and Z
  // never first.
  CA: {
    pattern: /^[ABCEGHJ-NPRSTVXY][0-9][ABCEGHJ-NPRSTV-Z] [0-9][ABCEGHJ-NPRSTV-Z][0-9]$/,
    expected: "CA postal code as A1A 1A1 (letter digit letter, space, digit letter digit)",
  },
  // Royal Mail, Programmers' Guide to the Postcode Address File, and the UK Government Data Standards
  // postcode rules (BS 7666) cited by postal-codes-js: outward code A9, A99, AA9, AA99, A9A or AA9A, one
  // space, inward code 9AA. Letters allowed by position: first not Q V X; second not I J Z; third (A9A)
  // A-H J K P S T U W; fourth (AA9A) A B E H M N P R V W X Y; inward letters not C I K M O V. GIR 0AA is
  // the one historic exception.
  GB: {
    pattern:
      /^(?:(?:[A-PR-UWYZ][0-9]{1,2}|[A-PR-UWYZ][A-HK-Y][0-9]{1,2}|[A-PR-UWYZ][0-9][A-HJKPSTUW]|[A-PR-UWYZ][A-HK-Y][0-9][ABEHMNPRV-Y]) [0-9][ABD-HJLNP-UW-Z]{2}|GIR 0AA)$/,
    expected: "GB postcode as outward code, space, inward code (e.g. A1 1AA, AB12 3CD, A1B 2CD)",
  },
  // Deutsche Post, Postleitzahlen since 1993: five digits; leading zone 0 starts at 01 (00 is unused).
  DE: { pattern: /^(?:0[1-9]|[1-9][0-9])[0-9]{3}$/, expected: "DE Postleitzahl as 5 digits from 01000 to 99999" },
  // PostNL: four digits (first not 0), one space, two capital letters; SA, SD and SS are not issued.
  NL: { pattern: /^[1-9][0-9]{3} (?!SA|SD|SS)[A-Z]{2}$/, expected: "NL postcode as 1234 AB (four digits, space, two capitals)" },
  // La Poste, code postal: five digits, the first two the département (01-95; Corsica 20; overseas
  // 97 and 98); 00 and 99 are not issued (from memory).
  FR: { pattern: /^(?:0[1-9]|[1-8][0-9]|9[0-8])[0-9]{3}$/, expected: "FR code postal as 5 digits starting 01 to 98" },
  // Japan Post: seven digits, written NNN-NNNN (Japan Post's own code lists give them without the hyphen).
  JP: { pattern: /^[0-9]{3}-?[0-9]{4}$/, expected: "JP postal code as 123-4567 or 1234567" },
  // Australia Post: four-digit postcode; those starting with 0 are 02xx-09xx (ACT, NT) (from memory).
  AU: { pattern: /^(?:0[2-9][0-9]{2}|[1-9][0-9]{3})$/, expected: "AU postcode as 4 digits from 0200 to 9999" },
  // Correios, CEP: eight digits written NNNNN-NNN (also found without the hyphen).
  BR: { pattern: /^[0-9]{5}-?[0-9]{3}$/, expected: "BR CEP as 12345-678 or 12345678" },
};
