import { nearMissAmong, said } from "../contract/near-miss.js";
import { mask } from "../report/mask.js";
import type { Plan } from "../contract/plan.js";
import type { Finding } from "../report/model.js";

export interface HeaderFinding {
  readonly check: number;
  readonly finding: Finding;
}

/** Where each declared column sits in the records (-1 when absent), and what is wrong with the header. */
export interface HeaderMatch {
  readonly positions: Int32Array;
  readonly width: number;
  readonly findings: readonly HeaderFinding[];
  /** Failures past MAX_HEADER_FINDINGS, by check: counted, never built (a header can have millions of cells). */
  readonly more?: ReadonlyMap<number, number>;
}

/** How many header findings are built; the rest are only counted. */
const MAX_HEADER_FINDINGS = 1000;

/** Declared columns taken positionally, for `header: none`. */
export function positional(plan: Plan): HeaderMatch {
  return { positions: Int32Array.from(plan.columns, (_, i) => i), width: plan.columns.length, findings: [] };
}

/** How many (missing, undeclared) name pairs a header may have and still get "did you mean" suggestions. */
const SUGGESTION_PAIRS = 10_000;

/**
 * Match a header record against the declared columns by trimmed name, whatever the policy, so the
 * rows can still be checked; the policy decides which differences are findings and at what level.
 */
export function matchHeader(plan: Plan, cells: readonly string[], line: number): HeaderMatch {
  const policy = plan.input.header;
  const names = cells.map((c) => c.trim());
  const positions = new Int32Array(plan.columns.length).fill(-1);
  const byName = new Map<string, number>();
  const findings: HeaderFinding[] = [];
  const at = (check: number, finding: Omit<Finding, "rule" | "level" | "line">) => {
    const meta = plan.checks[check];
    findings.push({ check, finding: { rule: meta?.rule ?? "", level: meta?.level ?? "error", line, ...finding } });
  };
  // A delivery sent without its header row has data where the names should be: a cell in the place
  // of a sensitive column is shown masked, as that column's cells always are, and never suggested.
  const secret = (i: number): boolean => plan.columns[i]?.sensitive === true;
  const shown = (name: string, i: number): string => (secret(i) ? mask(name) : name);
  let kept = 0;
  const more = new Map<number, number>();
  const keep = (check: number, finding: Omit<Finding, "rule" | "level" | "line">) => {
    if (++kept <= MAX_HEADER_FINDINGS) at(check, finding);
    else more.set(check, (more.get(check) ?? 0) + 1);
  };
  names.forEach((name, i) => {
    if (byName.has(name)) keep(plan.file.headerDuplicate, { column: shown(name, i), value: shown(name, i), expected: "each column named once", message: `header names ${JSON.stringify(shown(name, i))} twice (cells ${(byName.get(name) ?? 0) + 1} and ${i + 1})` });
    else byName.set(name, i);
  });
  const declared = new Set(plan.columns.map((c) => c.name));
  const extraAt = names.map((n, i) => i).filter((i) => !declared.has(names[i] as string) && byName.get(names[i] as string) === i);
  const extras = extraAt.filter((i) => !secret(i)).map((i) => names[i] as string);
  const missing = plan.columns.filter((c) => !byName.has(c.name)).map((c) => c.name);
  // A header far from its contract (thousands of names) gets no suggestions: they would be guesses,
  // and pairing every name with every other costs too much.
  const suggest = missing.length * extras.length <= SUGGESTION_PAIRS;
  const nearExtra = nearMissAmong(suggest ? extras : []);
  const nearMissing = nearMissAmong(suggest ? missing : []);
  for (const col of plan.columns) {
    const pos = byName.get(col.name);
    if (pos !== undefined) positions[col.index] = pos;
    else at(plan.file.headerMissing, { column: col.name, expected: col.name, message: `header has no column ${col.name}${said(nearExtra(col.name))}` });
  }
  for (const i of extraAt) {
    const name = shown(names[i] as string, i);
    keep(plan.file.headerUnexpected, { column: name, value: name, expected: "a declared column", message: `header has undeclared column ${JSON.stringify(name)}${secret(i) ? "" : said(nearMissing(name))}` });
  }
  // Order concerns the declared columns that are present, relative to each other: a missing, extra
  // or repeated name is its own finding and does not make the others "out of order".
  if (policy === "exact" || policy === "ordered") {
    const present = plan.columns.filter((c) => (positions[c.index] ?? -1) >= 0);
    const inOrder = present.every((c, i) => i === 0 || (positions[c.index] ?? 0) > (positions[present[i - 1]?.index ?? 0] ?? 0));
    if (!inOrder) {
      const found = present.slice().sort((a, b) => (positions[a.index] ?? 0) - (positions[b.index] ?? 0)).map((c) => c.name);
      at(plan.file.headerOrder, { value: found.join(","), expected: present.map((c) => c.name).join(","), message: `header lists the columns out of order: ${found.join(", ")}; expected ${present.map((c) => c.name).join(", ")}` });
    }
  }
  return { positions, width: cells.length, findings, ...(more.size > 0 ? { more } : {}) };
}
