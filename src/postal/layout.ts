/** How postal codes of one country are written, compiled once. */
export interface PostalLayout {
  readonly pattern: RegExp;
  /** the layout in words with a made-up example, e.g. "US ZIP code as 12345 or 12345-6789" */
  readonly expected: string;
}

/** Verdict on one postal code: `unknown` when no layout is known for the country (never a silent pass). */
export type PostalVerdict =
  | { readonly status: "valid" }
  | { readonly status: "invalid"; readonly expected: string }
  | { readonly status: "unknown"; readonly expected: string };
