/**
 * What a column's header name suggests. Names are split into lower-case words at anything that is
 * not a letter or digit and at camelCase humps, so `shipDate`, `ship_date` and `Ship Date` agree.
 */
export function nameWords(name: string): string[] {
  return name
    .replace(/([a-z0-9])([A-Z])/g, "$1 $2")
    .toLowerCase()
    .split(/[^a-z0-9]+/)
    .filter((w) => w !== "");
}

const DATE_WORDS = new Set(["date", "day", "dt", "dob", "birthday", "birthdate", "dated"]);

/** Whether the name reads like a date column (`ship_date`, `invoiceDate`, `dob`): spreadsheet serial numbers are then read as dates. */
export function suggestsDate(name: string): boolean {
  const words = nameWords(name);
  return words.some((w) => DATE_WORDS.has(w)) || /date$/.test(words[words.length - 1] ?? "");
}

// Common practice, no source: header words that usually mark data about a person.
const PERSONAL_WORDS = new Set([
  "email", "e", "mail", "phone", "mobile", "tel", "telephone", "fax", "contact", "ssn", "dob", "birthday", "birthdate",
  "birth", "address", "street", "surname", "forename", "firstname", "lastname", "fullname", "passport", "iban",
]);
const NAME_QUALIFIERS = new Set(["first", "last", "given", "family", "full", "middle", "maiden", "person", "customer", "employee", "patient", "contact"]);

/**
 * Why the name suggests personal data, or undefined. `e_mail`, `phone_no`, `first_name`, `contact`
 * match; `product_name` or `name` alone do not (a name of what?).
 */
export function personalDataHint(name: string): string | undefined {
  const words = nameWords(name);
  for (let i = 0; i < words.length; i++) {
    const w = words[i] as string;
    if (w === "e" && words[i + 1] === "mail") return "email";
    if (w !== "e" && PERSONAL_WORDS.has(w)) return w;
    if ((w === "name" || w === "names") && i > 0 && NAME_QUALIFIERS.has(words[i - 1] as string)) return `${words[i - 1]} ${w}`;
  }
  return undefined;
}
