import { checkPostal } from "../postal/index.js";
import { isIsoAlpha2 } from "../registry/iso-3166-1.js";
import type { Miss } from "./definition.js";
import type { CheckDefinition } from "./definition.js";

const ALPHA2 = /^[A-Z]{2}$/;

/**
 * `postal`: the postal code must follow the layout of a country, named by another column (holding
 * ISO 3166-1 alpha-2 codes) or by a literal alpha-2 code. A blank country leaves nothing to judge.
 */
export const postal: CheckDefinition = {
  name: "postal",
  key: "postal",
  types: ["text"],
  compile(spec, ctx) {
    const ref = spec.postal ?? "";
    const countryColumn = ctx.columnIndex(ref);
    if (countryColumn === undefined && !(ALPHA2.test(ref) && isIsoAlpha2(ref))) {
      const why = ALPHA2.test(ref) ? `"${ref}" is not an ISO 3166-1 code${ref === "UK" ? " (the United Kingdom is GB)" : ""}` : `"${ref}" is neither`;
      return [{ path: ["postal"], message: `postal must name a column or an ISO 3166-1 alpha-2 code; ${why} (columns: ${ctx.columnNames.join(", ")})` }];
    }
    // A sensitive country column must not show through this column's findings, not even as the
    // layout it implies.
    const hidden = countryColumn !== undefined && ctx.sensitive(ref);
    const misses = new Map<string, Miss>();
    const judge = (country: string, text: string): Miss | undefined => {
      const verdict = checkPostal(country, text);
      if (verdict.status === "valid") return undefined;
      const key = `${verdict.status}:${country}`;
      let m = misses.get(key);
      if (!m) {
        const which = hidden ? `of the country in ${ref}` : country;
        m = verdict.status === "invalid"
          ? { expected: hidden ? `a postal code of the country in ${ref}` : verdict.expected, reason: hidden ? `is not a valid postal code of the country in ${ref}` : `is not a valid ${country} postal code` }
          : { expected: hidden ? `a country with a known postal layout in ${ref}` : verdict.expected, reason: `cannot be judged: no postal layout known ${hidden ? which : `for ${country}`}`, level: "note" };
        misses.set(key, m);
      }
      return m;
    };
    const describe = countryColumn === undefined ? `a postal code of ${ref}` : `a postal code of the country in ${ref}`;
    return {
      description: `${ctx.column} is ${describe}`,
      test: countryColumn === undefined
        ? (_v, text) => judge(ref, text)
        : (_v, text, row) => {
            const country = (row.texts[countryColumn] ?? "").toUpperCase();
            return country === "" ? undefined : judge(country, text);
          },
    };
  },
};
