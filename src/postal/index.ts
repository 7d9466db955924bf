import type { PostalLayout, PostalVerdict } from "./layout.js";
import { libraryLayout } from "./library-layouts.js";
import { OPERATOR_LAYOUTS } from "./operator-layouts.js";

export type { PostalLayout, PostalVerdict } from "./layout.js";
export { OPERATOR_LAYOUTS } from "./operator-layouts.js";

const VALID: PostalVerdict = { status: "valid" };

interface Compiled {
  readonly layout: PostalLayout | undefined;
  readonly miss: PostalVerdict;
}

// Verdict objects are made once per country so the per-row path allocates nothing.
const compiled = new Map<string, Compiled>();

function compile(alpha2: string): Compiled {
  let c = compiled.get(alpha2);
  if (c) return c;
  // Only two capital letters are cached (at most 676 entries), whatever the delivery holds.
  if (!/^[A-Z]{2}$/.test(alpha2)) return { layout: undefined, miss: { status: "unknown", expected: `no postal layout known for ${alpha2}` } };
  const layout = Object.hasOwn(OPERATOR_LAYOUTS, alpha2) ? OPERATOR_LAYOUTS[alpha2] : libraryLayout(alpha2);
  c = layout
    ? { layout, miss: { status: "invalid", expected: layout.expected } }
    : { layout: undefined, miss: { status: "unknown", expected: `no postal layout known for ${alpha2}` } };
  compiled.set(alpha2, c);
  return c;
}

/** The layout tablegate uses for a country (ISO 3166-1 alpha-2, upper case); undefined when none is known. */
export function postalLayout(alpha2: string): PostalLayout | undefined {
  return compile(alpha2).layout;
}

/**
 * Judge a postal code as written (the caller trims the cell; inner spaces and dashes count) against the
 * layout of a country. Operator layouts for US CA GB DE NL FR JP AU BR, postal-codes-js for the rest.
 */
export function checkPostal(alpha2: string, code: string): PostalVerdict {
  const c = compile(alpha2);
  if (!c.layout) return c.miss;
  return c.layout.pattern.test(code) ? VALID : c.miss;
}
