import { createRequire } from "node:module";
import { describe, expect, it } from "vitest";
import { builtInTables, iso3166Data, type RefTable } from "../../src/registry/index.js";

const require = createRequire(import.meta.url);

async function builtIn(name: string): Promise<RefTable> {
  const r = await builtInTables();
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  const t = r.value.find((x) => x.name === name);
  if (!t) throw new Error(`no ${name}`);
  return t;
}

describe("iso-3166-1", () => {
  it("agrees with the iso-3166-1 npm package on every alpha-2, alpha-3 and numeric code", async () => {
    // Outside check: a second, independent general-purpose package (iso-3166-1 2.1.1 on npm).
    const other = (require("iso-3166-1") as { all(): { alpha2: string; alpha3: string; numeric: string }[] }).all();
    const t = await builtIn("iso-3166-1");
    expect([...t.keys()].sort()).toEqual(other.map((c) => c.alpha2).sort());
    for (const c of other) {
      expect([c.alpha2, t.get(c.alpha2, 1), t.get(c.alpha2, 2)]).toEqual([c.alpha2, c.alpha3, c.numeric]);
    }
  });

  it("keeps numeric codes as three-digit text and leaves out the user-assigned XK", async () => {
    const t = await builtIn("iso-3166-1");
    // ISO 3166-1: Afghanistan is 004 (leading zeros are part of the code).
    expect(t.get("AF", t.columns.indexOf("numeric"))).toBe("004");
    expect(t.row("XK")).toBeUndefined();
    expect(t.rows).toBe(249);
    expect(t.columns).toEqual(["alpha2", "alpha3", "numeric", "name"]);
    expect(t.builtIn).toBe(true);
  });

  it("hashes a canonical CSV rendering that quotes names with commas", () => {
    const { csv, rows } = iso3166Data();
    const lines = csv.split("\r\n");
    expect(lines[0]).toBe("alpha2,alpha3,numeric,name");
    expect(lines.length).toBe(rows.length + 2); // header, rows, empty after the final CRLF
    const withComma = rows.find((r) => (r[3] ?? "").includes(","));
    if (withComma) expect(csv).toContain(`"${withComma[3]}"`);
  });
});

// U.S. Census Bureau, "Census Regions and Divisions of the United States", as copied into
// shared/notes/reference-facts.md.
const CENSUS: readonly [string, string, string][] = [
  ["Northeast", "New England", "CT ME MA NH RI VT"],
  ["Northeast", "Middle Atlantic", "NJ NY PA"],
  ["Midwest", "East North Central", "IL IN MI OH WI"],
  ["Midwest", "West North Central", "IA KS MN MO NE ND SD"],
  ["South", "South Atlantic", "DE DC FL GA MD NC SC VA WV"],
  ["South", "East South Central", "AL KY MS TN"],
  ["South", "West South Central", "AR LA OK TX"],
  ["West", "Mountain", "AZ CO ID MT NV NM UT WY"],
  ["West", "Pacific", "AK CA HI OR WA"],
];

describe("us-states", () => {
  it("matches the census regions and divisions table, state by state", async () => {
    const t = await builtIn("us-states");
    const region = t.columns.indexOf("region");
    const division = t.columns.indexOf("division");
    const expected = CENSUS.flatMap(([r, d, codes]) => codes.split(" ").map((c) => [c, r, d]));
    expect(t.rows).toBe(expected.length);
    for (const [code, r, d] of expected) expect([code, t.get(code ?? "", region), t.get(code ?? "", division)]).toEqual([code, r, d]);
  });

  it("covers exactly the states and DC of ISO 3166-2:US, without territories or military codes", async () => {
    // Outside check: iso-3166-2 1.0.0 on npm lists US subdivisions (states, DC, outlying areas).
    const sub = (require("iso-3166-2") as { country(c: string): { sub: Record<string, { type: string }> } }).country("US").sub;
    const statesAndDc = Object.entries(sub).filter(([, v]) => v.type === "State" || v.type === "District").map(([k]) => k.slice(3));
    const t = await builtIn("us-states");
    expect([...t.keys()].sort()).toEqual(statesAndDc.sort());
    // USPS Publication 28 territory, freely associated and military codes (reference-facts.md)
    for (const code of ["PR", "VI", "GU", "AS", "MP", "FM", "MH", "PW", "AA", "AE", "AP"]) expect(t.row(code)).toBeUndefined();
  });
});

describe("ca-provinces", () => {
  it("matches ISO 3166-2:CA codes, names and kinds", async () => {
    // Outside check: iso-3166-2 1.0.0 on npm (10 provinces, 3 territories).
    const sub = (require("iso-3166-2") as { country(c: string): { sub: Record<string, { type: string; name: string }> } }).country("CA").sub;
    const t = await builtIn("ca-provinces");
    expect(t.rows).toBe(Object.keys(sub).length);
    for (const [iso, v] of Object.entries(sub)) {
      const code = iso.slice(3);
      expect(t.row(code)).toEqual([code, iso, v.name, v.type.toLowerCase()]);
    }
  });
});
