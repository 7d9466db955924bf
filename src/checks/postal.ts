import { checkPostal } from "../postal/index.js";
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
    if (countryColumn === undefined && !ALPHA2.test(ref)) {
      return [{ path: ["postal"], message: `postal must name a column or an ISO 3166-1 alpha-2 code; "${ref}" is neither (columns: ${ctx.columnNames.join(", ")})` }];
    }
    const misses = new Map<string, Miss>();
    const judge = (country: string, text: string): Miss | undefined => {
      const verdict = checkPostal(country, text);
      if (verdict.status === "valid") return undefined;
      const key = `${verdict.status}:${country}`;
      let m = misses.get(key);
      if (!m) {
        m = verdict.status === "invalid"
          ? { expected: verdict.expected, reason: `is not a valid ${country} postal code` }
          : { expected: verdict.expected, reason: `cannot be judged: no postal layout known for ${country}`, level: "note" };
        misses.set(key, m);
      }
      return m;
    };
    const describe = countryColumn === undefined ? `a ${ref} postal code` : `a postal code of the country in ${ref}`;
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
