import { readFile } from "node:fs/promises";
import { checkFile } from "../check.js";
import { compileContract } from "../contract/load.js";
import type { Plan } from "../contract/plan.js";
import { parseYamlSource, problemAt, yamlData, type YamlPath, type YamlSource } from "../contract/yaml-source.js";
import type { Node } from "../expr/ast.js";
import { parse } from "../expr/parser.js";
import { fail, ok, type Problem, type Result } from "../problem.js";
import { contractFor, type ProjectConfig } from "../project/config.js";
import { routedFiles } from "../project/files.js";
import { globToRegExp } from "../project/glob.js";
import type { DeliveryReport, Finding } from "../report/model.js";
import { revisionWithContent, tableAtRevision } from "./git.js";
import type { Registry } from "./load.js";
import { LOCK_FILE, readLock } from "./lock.js";
import { resolveInside } from "./paths.js";
import type { RefTable } from "./ref-table.js";

/** Contracts found without tablegate.yaml, relative to the repository root. */
export const CONTRACT_GLOB = "contracts/**/*.contract.yaml";

/** One place in a contract where a check reads the table. */
export interface TableReader {
  /** codes: `codes: {table}`; when: a column's `when` (it gates every check of the column); assert/when of a rule or group */
  readonly via: "codes" | "when" | "assert";
  /** `<column>.codes`, `rule:<id>`, `group:<id>`, or for a column's `when` the column's checks (`<column>.*` until compiled) */
  readonly rules: readonly string[];
  /** the column, for `codes` and a column's `when` */
  readonly column?: string;
  readonly line: number;
  readonly col: number;
}

/** A row whose findings of the table-reading checks differ between the locked and the working table (a finding of one side). */
export type RowChange = Omit<Finding, "expected">;

/** How a contract stands with the table. */
export interface ContractImpact {
  readonly path: string;
  readonly name?: string;
  readonly readers: readonly TableReader[];
  /** whether the contract compiles against the registry with the working copy of the table */
  readonly compilesNow: boolean;
  /** whether it compiles with the locked table instead; absent when the locked table is not at hand */
  readonly compilesLocked?: boolean;
  /** why it does not compile (against the working copy when it fails there, else against the locked table) */
  readonly problems: readonly Problem[];
}

/** One delivery checked under both versions of the table. */
export interface DeliveryImpact {
  readonly path: string;
  readonly contract: string;
  readonly rows: number;
  /** fails now, passed under the lock */
  readonly failsNow: readonly RowChange[];
  /** passes now, failed under the lock */
  readonly passesNow: readonly RowChange[];
  /** some findings were left out of a report (raise --max-findings) */
  readonly truncated: boolean;
}

/** A delivery matched by --data that was not checked, and why. */
export interface SkippedDelivery {
  readonly path: string;
  readonly reason: "unclaimed" | "contract-does-not-read-table" | "contract-does-not-compile";
  readonly contract?: string;
}

/** What `ref impact` found. */
export interface ImpactReport {
  readonly table: string;
  readonly working: { readonly version: string; readonly sha256: string };
  /** the table as locked (or at --from); absent when it could not be read and no deliveries were asked for */
  readonly locked?: { readonly revision: string; readonly version: string; readonly sha256: string; readonly same: boolean };
  /** why `locked` is absent */
  readonly lockedProblem?: Problem;
  readonly contracts: readonly ContractImpact[];
  readonly deliveries: readonly DeliveryImpact[];
  readonly skipped: readonly SkippedDelivery[];
}

/** What `ref impact` needs from its caller. */
export interface ImpactOptions {
  readonly registry: Registry;
  readonly config: ProjectConfig;
  /** root-relative globs of deliveries to check under both tables */
  readonly data: readonly string[];
  /** root-relative contract judging every --data file; default: tablegate.yaml routes */
  readonly contract?: string;
  /** git revision to compare with instead of the lock */
  readonly from?: string;
  readonly maxFindings?: number;
}

type Walkable = Node | null | undefined;

/** Every child node of an expression node. */
function children(n: Node): Walkable[] {
  switch (n.type) {
    case "typed":
      return [n.text];
    case "call":
      return [...n.args];
    case "unary":
    case "is":
      return [n.operand];
    case "binary":
    case "logical":
    case "distinct":
      return [n.left, n.right];
    case "between":
      return [n.operand, n.low, n.high];
    case "in":
      return [n.operand, ...n.items];
    case "like":
      return [n.operand, n.pattern, n.escape];
    case "case":
      return [n.subject, ...n.branches.flatMap((b) => [b.when, b.then]), n.otherwise];
    default:
      return [];
  }
}

/**
 * Offsets of the `lookup('<table>', ...)` calls in an expression, found in the expression parser's
 * syntax tree (so a table name inside another string literal or a comment-like text never counts).
 * An expression that does not parse reads nothing; compiling the contract reports it.
 */
export function lookupOffsets(source: string, table: string): number[] {
  const parsed = parse(source);
  if (!parsed.ok) return [];
  const out: number[] = [];
  const stack: Walkable[] = [parsed.node];
  while (stack.length > 0) {
    const n = stack.pop();
    if (!n) continue;
    if (n.type === "call" && n.name.toLowerCase() === "lookup") {
      const first = n.args[0];
      if (first?.type === "text" && first.value === table) out.push(n.start);
    }
    stack.push(...children(n));
  }
  return out.sort((a, b) => a - b);
}

function isRecord(v: unknown): v is Record<string, unknown> {
  return v !== null && typeof v === "object" && !Array.isArray(v);
}

/** Where each check of a contract reads `table`, from the contract's YAML (before compiling). */
export function tableReaders(src: YamlSource, table: string): TableReader[] {
  const read = yamlData(src);
  const data = read.ok ? read.value : undefined;
  if (!isRecord(data)) return [];
  const out: TableReader[] = [];
  const at = (path: YamlPath, offset?: number): { line: number; col: number } => {
    const p = problemAt(src, path, "", offset === undefined ? {} : { offset });
    return { line: p.line ?? 1, col: p.column ?? 1 };
  };
  const expr = (value: unknown, path: YamlPath, reader: Omit<TableReader, "line" | "col">): void => {
    if (typeof value !== "string") return;
    const first = lookupOffsets(value, table)[0];
    if (first !== undefined) out.push({ ...reader, ...at(path, first) });
  };
  if (isRecord(data.columns)) {
    for (const [name, col] of Object.entries(data.columns)) {
      if (!isRecord(col)) continue;
      if (isRecord(col.codes) && col.codes.table === table) out.push({ via: "codes", rules: [`${name}.codes`], column: name, ...at(["columns", name, "codes", "table"]) });
      expr(col.when, ["columns", name, "when"], { via: "when", rules: [`${name}.*`], column: name });
    }
  }
  for (const [key, prefix] of [["rules", "rule:"], ["groups", "group:"]] as const) {
    const list = data[key];
    if (!Array.isArray(list)) continue;
    list.forEach((item: unknown, i) => {
      if (!isRecord(item) || typeof item.id !== "string") return;
      const rules = [`${prefix}${item.id}`];
      const before = out.length;
      expr(item.assert, [key, i, "assert"], { via: "assert", rules });
      if (out.length === before) expr(item.when, [key, i, "when"], { via: "when", rules });
    });
  }
  return out;
}

/** Readers with a column's `when` expanded to the rule ids of every check the plan made for the column. */
export function expandReaders(readers: readonly TableReader[], plan: Plan): TableReader[] {
  return readers.map((r) => {
    if (r.via !== "when" || r.column === undefined) return r;
    const col = plan.columns.find((c) => c.name === r.column);
    if (!col) return r;
    const ids = [col.typeCheck, col.requiredCheck, col.spacesCheck, ...col.cellChecks.map((c) => c.check)];
    return { ...r, rules: ids.filter((i) => i >= 0).map((i) => plan.checks[i]?.rule ?? "").filter((s) => s !== "") };
  });
}

function change(f: Finding): RowChange {
  return {
    rule: f.rule,
    level: f.level,
    ...(f.row === undefined ? {} : { row: f.row }),
    ...(f.line === undefined ? {} : { line: f.line }),
    ...(f.column === undefined ? {} : { column: f.column }),
    ...(f.value === undefined ? {} : { value: f.value }),
    message: f.message,
  };
}

// A finding is the same in both runs when it is the same check on the same row and column; its
// message may differ (it can quote what the table said).
const identity = (f: Finding): string => `${f.rule}\u001f${f.row ?? ""}\u001f${f.column ?? ""}`;

const byRow = (a: RowChange, b: RowChange): number => (a.row ?? 0) - (b.row ?? 0) || (a.rule < b.rule ? -1 : a.rule > b.rule ? 1 : 0);

/** Findings of the `rules` checks that one report has and the other has not, both ways. */
export function compareFindings(locked: DeliveryReport, working: DeliveryReport, rules: ReadonlySet<string>): { failsNow: RowChange[]; passesNow: RowChange[] } {
  const pick = (r: DeliveryReport) => new Map(r.findings.filter((f) => rules.has(f.rule)).map((f) => [identity(f), f] as const));
  const before = pick(locked);
  const after = pick(working);
  const failsNow = [...after].filter(([k]) => !before.has(k)).map(([, f]) => change(f)).sort(byRow);
  const passesNow = [...before].filter(([k]) => !after.has(k)).map(([, f]) => change(f)).sort(byRow);
  return { failsNow, passesNow };
}

/** The registry with one table swapped for another version of it. */
export function withTable(registry: Registry, table: RefTable): Registry {
  return {
    table: (name) => (name === table.name ? table : registry.table(name)),
    tables: () => registry.tables().map((t) => (t.name === table.name ? table : t)),
  };
}

/** The table as the lock pins it (read back from git history), or as it was at `from`. */
export async function lockedVersion(root: string, working: RefTable, from?: string): Promise<Result<{ table: RefTable; revision: string; same: boolean }>> {
  if (working.builtIn) return fail({ file: working.file, message: `table "${working.name}" is built in: it changes only with tablegate's own version` });
  if (working.origin.startsWith("node_modules/")) return fail({ file: working.origin, message: `table "${working.name}" comes from an npm package, which is not in git history` });
  let rev = from;
  if (rev === undefined) {
    const lock = await readLock(root);
    if (!lock.ok) return lock;
    const entry = lock.value?.tables[working.name];
    if (!entry) return fail({ file: LOCK_FILE, message: `table "${working.name}" is not in the lock; give --from <git-rev>` });
    if (entry.sha256 === working.sha256) return ok({ table: working, revision: "lock", same: true });
    const found = await revisionWithContent(root, entry.file, entry.sha256);
    if (!found.ok) return found;
    if (found.value === undefined) return fail({ file: LOCK_FILE, message: `the locked content of "${working.name}" is not in the git history of ${entry.file}; give --from <git-rev>` });
    rev = found.value;
  }
  const before = await tableAtRevision(root, rev, working.name, working.origin);
  if (!before.ok) return before;
  return ok({ table: before.value, revision: rev, same: before.value.sha256 === working.sha256 });
}

/** Root-relative files matching any of the globs (node_modules, .git and dist skipped), sorted. */
export function filesMatching(root: string, globs: readonly string[]): Promise<string[]> {
  return routedFiles(root, { registries: [], present: true, routes: [{ globs, matchers: globs.map(globToRegExp), contract: "" }] });
}

interface LoadedContract {
  readonly impact: ContractImpact;
  readonly working?: Plan;
  readonly locked?: Plan;
  readonly rules: ReadonlySet<string>;
}

async function readContract(root: string, path: string): Promise<Result<string>> {
  const found = await resolveInside(root, path);
  if ("escapes" in found) return fail({ file: path, message: "contract lies outside the repository" });
  if ("missing" in found) return fail({ file: path, message: "cannot read contract: no such file" });
  try {
    return ok(await readFile(found.abs, "utf8"));
  } catch (e) {
    return fail({ file: path, message: `cannot read contract: ${(e as Error).message}` });
  }
}

async function loadContractBoth(root: string, path: string, table: string, working: Registry, locked: Registry | undefined): Promise<LoadedContract | undefined> {
  const text = await readContract(root, path);
  if (!text.ok) return { impact: { path, readers: [], compilesNow: false, problems: text.problems }, rules: new Set() };
  const src = parseYamlSource(path, text.value);
  const readers = tableReaders(src, table);
  const w = compileContract(path, text.value, { registry: working });
  const referenced = w.ok && w.value.references.some((r) => r.table === table);
  if (readers.length === 0 && !referenced) return undefined;
  const l = locked ? compileContract(path, text.value, { registry: locked }) : undefined;
  const plan = w.ok ? w.value : l?.ok ? l.value : undefined;
  const expanded = plan ? expandReaders(readers, plan) : readers;
  const impact: ContractImpact = {
    path,
    ...(plan ? { name: plan.name } : {}),
    readers: expanded,
    compilesNow: w.ok,
    ...(l === undefined ? {} : { compilesLocked: l.ok }),
    problems: w.ok ? (l && !l.ok ? l.problems : []) : w.problems,
  };
  return {
    impact,
    ...(w.ok ? { working: w.value } : {}),
    ...(l?.ok ? { locked: l.value } : {}),
    rules: new Set(expanded.flatMap((r) => r.rules)),
  };
}

/**
 * Which contracts read `table` and through which checks; with `data`, which rows of those deliveries
 * fail under the working copy of the table that passed under the locked one, and the reverse.
 */
export async function tableImpact(root: string, tableName: string, options: ImpactOptions): Promise<Result<ImpactReport>> {
  const current = options.registry.table(tableName);
  if (!current) return fail({ file: "(arguments)", message: `unknown table "${tableName}" (tables: ${options.registry.tables().map((t) => t.name).join(", ")})` });
  const wantData = options.data.length > 0;
  const before = current.builtIn && !wantData ? undefined : await lockedVersion(root, current, options.from);
  if (before && !before.ok && wantData) return before;
  const lockedReg = before?.ok ? withTable(options.registry, before.value.table) : undefined;

  const contractPaths = new Set<string>(options.config.routes.map((r) => r.contract));
  for (const f of await filesMatching(root, [CONTRACT_GLOB])) contractPaths.add(f);
  if (options.contract !== undefined) contractPaths.add(options.contract);
  const loaded = new Map<string, LoadedContract>();
  for (const path of [...contractPaths].sort()) {
    const c = await loadContractBoth(root, path, tableName, options.registry, lockedReg);
    if (c) loaded.set(path, c);
  }

  const deliveries: DeliveryImpact[] = [];
  const skipped: SkippedDelivery[] = [];
  if (wantData && before?.ok) {
    // Without tablegate.yaml routes, the files go to the one contract that reads the table, when there
    // is just one; with routes, a file no route claims stays unchecked.
    const readers = [...loaded.keys()];
    const sole = options.config.routes.length === 0 && readers.length === 1 ? readers[0] : undefined;
    for (const file of await filesMatching(root, options.data)) {
      const contract = options.contract ?? contractFor(options.config, file) ?? sole;
      if (contract === undefined) {
        skipped.push({ path: file, reason: "unclaimed" });
        continue;
      }
      const c = loaded.get(contract);
      if (!c) {
        skipped.push({ path: file, reason: "contract-does-not-read-table", contract });
        continue;
      }
      if (!c.working || !c.locked) {
        skipped.push({ path: file, reason: "contract-does-not-compile", contract });
        continue;
      }
      const opts = { reportPath: file, contractPath: contract, maxFindings: options.maxFindings ?? 100_000 };
      const abs = await resolveInside(root, file);
      if (!("abs" in abs)) return fail({ file, message: "cannot read delivery" });
      const w = await checkFile(c.working, abs.abs, opts);
      if (!w.ok) return w;
      const l = await checkFile(c.locked, abs.abs, opts);
      if (!l.ok) return l;
      const diff = compareFindings(l.value, w.value, c.rules);
      deliveries.push({ path: file, contract, rows: w.value.input.rows, ...diff, truncated: w.value.truncated || l.value.truncated });
    }
  }

  return ok({
    table: tableName,
    working: { version: current.version, sha256: current.sha256 },
    ...(before?.ok ? { locked: { revision: before.value.revision, version: before.value.table.version, sha256: before.value.table.sha256, same: before.value.same } } : {}),
    ...(before && !before.ok && before.problems[0] ? { lockedProblem: before.problems[0] } : {}),
    contracts: [...loaded.values()].map((c) => c.impact),
    deliveries,
    skipped,
  });
}

/**
 * True when the working table breaks something: a row with a new error-level finding (what makes `check`
 * fail by default), or a contract that compiled with the locked table and no longer does.
 */
export function breaks(report: ImpactReport): boolean {
  return report.deliveries.some((d) => d.failsNow.some((c) => c.level === "error")) || report.contracts.some((c) => c.compilesLocked === true && !c.compilesNow);
}
