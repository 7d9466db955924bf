/**
 * Masked forms of sensitive cell values. The mask keeps enough shape to debug a delivery (kind of
 * value, length, separators, whitespace) while showing at most about a quarter of the characters:
 *
 * - e-mail (one `@`, a dotted domain, no whitespace): `j***@***.org`: the first character of the
 *   local part only when that part has 4 or more characters, and the top-level domain only when it
 *   is 2 to 6 ASCII letters (else `***`). Length is not kept.
 * - digits with separators (only 0-9 and `space - . / ( ) + ,`, at most 40 characters): separators
 *   stay, every digit becomes `*`, except that the last 4 digits stay when the value has 9 or more
 *   digits and ends in a run of at least 4 digits (SSN, card, phone, account numbers:
 *   `***-**-1234`). Dates (8 digits) and amounts with a fraction (`*****.**`) are masked whole.
 * - other text: whitespace stays, every other character becomes `*`, except the first
 *   non-whitespace character when there are 4 or more of them (`Alexander` → `A********`,
 *   `Al` → `**`). Length is kept exactly (in code points) up to 64; longer values keep their first
 *   64 masked and end in `…(+N)` with N the code points left out.
 * - A non-empty value is never returned unchanged: a value that already looks masked (`****`,
 *   `   `) becomes `#` per code point. The empty string stays empty.
 */

const TEXT_CAP = 64;
const DIGITS_MAX = 40;
const KEEP_LAST_DIGITS = 4;
const MIN_DIGITS_TO_KEEP_LAST = 9;
const DIGIT_SEPARATORS = new Set([" ", "-", ".", "/", "(", ")", "+", ","]);
const WHITESPACE = /\s/;
const TLD = /^[A-Za-z]{2,6}$/;

/** The masked form of a sensitive value: deterministic, never the value itself when non-empty. */
export function mask(value: string): string {
  if (value === "") return "";
  const cps = Array.from(value);
  const masked = maskEmail(value) ?? maskDigits(cps) ?? maskText(cps);
  return masked === value ? capped(cps.map(() => "#"), cps.length) : masked;
}

function maskEmail(value: string): string | undefined {
  const at = value.indexOf("@");
  if (at <= 0 || at !== value.lastIndexOf("@")) return undefined;
  for (const ch of value) if (WHITESPACE.test(ch)) return undefined;
  const domain = value.slice(at + 1);
  const dot = domain.lastIndexOf(".");
  if (dot <= 0 || dot === domain.length - 1 || domain.startsWith(".") || domain.includes("..")) return undefined;
  const local = Array.from(value.slice(0, at));
  const tld = domain.slice(dot + 1);
  const first = local.length >= 4 ? (local[0] as string) : "";
  return `${first}***@***.${TLD.test(tld) ? tld : "***"}`;
}

function maskDigits(cps: readonly string[]): string | undefined {
  if (cps.length > DIGITS_MAX) return undefined;
  let digits = 0;
  let trailingRun = 0;
  for (const ch of cps) {
    if (ch >= "0" && ch <= "9") {
      digits++;
      trailingRun++;
    } else if (DIGIT_SEPARATORS.has(ch)) {
      trailingRun = 0;
    } else {
      return undefined;
    }
  }
  if (digits === 0) return undefined;
  const keepFrom = digits >= MIN_DIGITS_TO_KEEP_LAST && trailingRun >= KEEP_LAST_DIGITS ? digits - KEEP_LAST_DIGITS : digits;
  let seen = 0;
  let out = "";
  for (const ch of cps) {
    if (ch >= "0" && ch <= "9") {
      out += seen >= keepFrom ? ch : "*";
      seen++;
    } else {
      out += ch;
    }
  }
  return out;
}

function maskText(cps: readonly string[]): string {
  let visible = 0;
  for (const ch of cps) if (!WHITESPACE.test(ch)) visible++;
  let showFirst = visible >= 4;
  const out = cps.map((ch) => {
    if (WHITESPACE.test(ch)) return ch;
    if (showFirst) {
      showFirst = false;
      return ch;
    }
    return "*";
  });
  return capped(out, cps.length);
}

function capped(parts: readonly string[], total: number): string {
  if (total <= TEXT_CAP) return parts.join("");
  return `${parts.slice(0, TEXT_CAP).join("")}…(+${total - TEXT_CAP})`;
}
