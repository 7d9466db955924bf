import { isAbsolute, join } from "node:path";
import { formatProblem, type Problem } from "../problem.js";
import {
  compareLock,
  diffTables,
  isEmptyDiff,
  LOCK_FILE,
  lockIssueProblem,
  loadRegistry,
  readLock,
  revisionWithContent,
  tableAtRevision,
  tableListedAtRevision,
  writeLock,
  type LockIssue,
  type RefTable,
  type Registry,
  type RegistryRoot,
  type TableDiff,
} from "../registry/index.js";
import { loadProjectConfig, type ProjectConfig } from "../project/config.js";
import { breaks, tableImpact, type ImpactReport, type RowChange } from "../registry/impact.js";
import type { Io } from "./io.js";
import { badArgument, commandArgs, showUsage } from "./problems.js";
import { REPO_MANIFEST } from "../registry/index.js";
import { oneLine } from "../report/one-line.js";
import { registryLintReports } from "./ref-lint-report.js";
import { parseReportTargets, writeReports } from "./reports.js";
import { findRoot, reportPath } from "./root.js";

/** What `ref` needs of the outside world (a subset of the CLI's Io). */
export interface RefIo {
  readonly stdout: (s: string) => void;
  readonly stderr: (s: string) => void;
  readonly cwd: string;
}

/** Further registries (from tablegate.yaml), passed in by the caller that read the project file. */
export interface RefOptions {
  readonly registries?: readonly RegistryRoot[];
  /** the project file, when the caller has read it (`ref impact` reads it itself otherwise) */
  readonly config?: ProjectConfig;
}

export const REF_USAGE = `tablegate ref list [--json]
  tablegate ref show <table> [--page N] [--page-size N]
  tablegate ref lint [--json] [--report <format>=<path>]...
  tablegate ref lock
  tablegate ref diff <table> [--from <git-rev>] [--json]
  tablegate ref impact <table> [--data <glob>]... [--contract <c>] [--from <git-rev>] [--max-findings N] [--json]`;

const PASS = 0;
const FAIL = 1;
const UNUSABLE = 2;

type Sub = (positionals: readonly string[], values: Values, ctx: Ctx) => Promise<number>;

interface Values {
  readonly json?: boolean;
  readonly from?: string;
  readonly data?: readonly string[];
  readonly contract?: string;
  readonly "max-findings"?: string;
  readonly page?: string;
  readonly "page-size"?: string;
  readonly report?: readonly string[];
}

interface Ctx {
  readonly io: RefIo;
  readonly root: string;
  readonly roots: readonly RegistryRoot[];
  readonly config?: ProjectConfig;
}

function problems(io: RefIo, list: readonly Problem[], status = UNUSABLE): number {
  for (const p of list) io.stderr(`tablegate: ${formatProblem(p)}\n`);
  return status;
}

function bad(io: RefIo, message: string): number {
  return badArgument(io, "ref", message);
}

async function registryOr(ctx: Ctx): Promise<Registry | number> {
  const r = await loadRegistry(ctx.root, ctx.roots);
  return r.ok ? r.value : problems(ctx.io, r.problems);
}

/** Every problem of the tables that did not load, in manifest order. */
const brokenProblems = (reg: Registry): Problem[] => [...(reg.broken?.().values() ?? [])].flat();

/** The exit status for a command on table `name` when that table did not load; undefined when it did. */
function whenBroken(ctx: Ctx, reg: Registry, name: string): number | undefined {
  const found = reg.broken?.().get(name);
  return found === undefined ? undefined : problems(ctx.io, found);
}

function lockState(t: RefTable, issues: readonly LockIssue[]): string {
  if (t.builtIn) return "built-in";
  const issue = issues.find((i) => i.table === t.name);
  return issue ? (issue.kind === "changed" ? "differs from lock" : "not locked") : "locked";
}

const list: Sub = async (_p, values, ctx) => {
  const reg = await registryOr(ctx);
  if (typeof reg === "number") return reg;
  const lock = await readLock(ctx.root);
  if (!lock.ok) return problems(ctx.io, lock.problems);
  const issues = compareLock(lock.value, reg);
  const rows = reg.tables().map((t) => ({ table: t.name, version: t.version, rows: t.rows, key: t.key, columns: t.columns, origin: t.origin, lock: lockState(t, issues), description: t.description ?? "" }));
  // Tables that did not load are not listed; say so, without failing the listing of the others.
  for (const name of reg.broken?.().keys() ?? []) ctx.io.stderr(`tablegate: table "${name}" did not load and is not listed; tablegate ref lint shows why\n`);
  if (values.json) {
    ctx.io.stdout(JSON.stringify(rows, null, 2) + "\n");
    return PASS;
  }
  ctx.io.stdout(columns([["table", "version", "rows", "key", "lock", "origin"], ...rows.map((r) => [r.table, r.version, String(r.rows), r.key, r.lock, r.origin])]));
  return PASS;
};

const show: Sub = async (positionals, values, ctx) => {
  const [name] = positionals;
  if (name === undefined || positionals.length > 1) return bad(ctx.io, "ref show needs one table name");
  const page = wholeNumber(values.page ?? "1", 1);
  const size = wholeNumber(values["page-size"] ?? "50", 1);
  if (page === undefined || size === undefined) return bad(ctx.io, "--page and --page-size take whole numbers from 1");
  const reg = await registryOr(ctx);
  if (typeof reg === "number") return reg;
  const t = reg.table(name);
  if (!t) return whenBroken(ctx, reg, name) ?? bad(ctx.io, `unknown table "${name}" (tables: ${reg.tables().map((x) => x.name).join(", ")})`);
  const pages = Math.max(1, Math.ceil(t.rows / size));
  if (page > pages) return bad(ctx.io, `table "${name}" has ${pages} page${pages === 1 ? "" : "s"} of ${size} rows; there is no page ${page}`);
  const keys = t.keys().slice((page - 1) * size, page * size);
  const out = ctx.io.stdout;
  out(`${t.name} ${t.version}: ${t.rows} rows, key ${t.key}, ${t.file}\n`);
  if (t.source) out(`source: ${t.source}\n`);
  if (t.description) out(`${t.description}\n`);
  out("\n" + columns([[...t.columns], ...keys.map((k) => [...(t.row(k) ?? [])])]));
  out(`\npage ${page} of ${pages}${page < pages ? ` (next: --page ${page + 1})` : ""}\n`);
  return PASS;
};

const lint: Sub = async (_p, values, ctx) => {
  const targets = parseReportTargets(values.report ?? []);
  if (!targets.ok) return bad(ctx.io, targets.message);
  const report = async (status: number, tables: number, found: readonly (Problem & { table?: string; kind?: string })[]): Promise<number> => {
    if (targets.value.length > 0) {
      const written = await writeReports(await registryLintReports(ctx.root, REPO_MANIFEST, found), targets.value, { ...ctx.io, env: {} }, ctx.root);
      return written.ok ? status : problems(ctx.io, written.problems);
    }
    if (!values.json) return found.length > 0 ? problems(ctx.io, found, status) : status;
    ctx.io.stdout(JSON.stringify({ ok: found.length === 0, tables, problems: found }, null, 2) + "\n");
    return status;
  };
  const reg = await loadRegistry(ctx.root, ctx.roots);
  if (!reg.ok) return report(FAIL, 0, reg.problems);
  const broken = brokenProblems(reg.value);
  if (broken.length > 0) return report(FAIL, reg.value.tables().length, broken);
  const lock = await readLock(ctx.root);
  if (!lock.ok) return report(FAIL, reg.value.tables().length, lock.problems);
  const issues = compareLock(lock.value, reg.value);
  if (issues.length > 0) return report(FAIL, reg.value.tables().length, issues.map((i) => ({ ...lockIssueProblem(i), table: i.table, kind: i.kind })));
  if (values.json || targets.value.length > 0) return report(PASS, reg.value.tables().length, []);
  ctx.io.stdout(`registry ok: ${reg.value.tables().length} tables, lock matches\n`);
  return PASS;
};

const lock: Sub = async (_p, _v, ctx) => {
  const reg = await registryOr(ctx);
  if (typeof reg === "number") return reg;
  // A lock records every table; one that does not load cannot be recorded.
  const broken = brokenProblems(reg);
  if (broken.length > 0) return problems(ctx.io, broken);
  const written = await writeLock(ctx.root, reg);
  if (!written.ok) return problems(ctx.io, written.problems);
  const n = Object.keys(written.value.lock.tables).length;
  ctx.io.stdout(written.value.changed ? `wrote ${LOCK_FILE} (${n} tables)\n` : `${LOCK_FILE} is up to date (${n} tables)\n`);
  return PASS;
};

const diff: Sub = async (positionals, values, ctx) => {
  const [name] = positionals;
  if (name === undefined || positionals.length > 1) return bad(ctx.io, "ref diff needs one table name");
  const reg = await registryOr(ctx);
  if (typeof reg === "number") return reg;
  const after = reg.table(name);
  if (!after) return whenBroken(ctx, reg, name) ?? bad(ctx.io, `unknown table "${name}"`);
  if (after.builtIn) return problems(ctx.io, [{ file: after.file, message: `table "${name}" is built in: it changes only with tablegate's own version` }]);
  if (after.origin.startsWith("node_modules/")) return problems(ctx.io, [{ file: after.origin, message: `table "${name}" comes from an npm package, which is not in git history; compare package versions instead` }]);
  let rev = values.from;
  if (rev === undefined) {
    const lockFile = await readLock(ctx.root);
    if (!lockFile.ok) return problems(ctx.io, lockFile.problems);
    const entry = lockFile.value?.tables[name];
    if (!entry) return problems(ctx.io, [{ file: LOCK_FILE, message: `table "${name}" is not in the lock; give --from <git-rev>` }]);
    if (entry.sha256 === after.sha256) {
      ctx.io.stdout(values.json ? JSON.stringify(emptyDiff(after), null, 2) + "\n" : `${name}: same content as the lock\n`);
      return PASS;
    }
    const found = await revisionWithContent(ctx.root, entry.file, entry.sha256);
    if (!found.ok) return problems(ctx.io, found.problems);
    if (found.value === undefined) return problems(ctx.io, [{ file: LOCK_FILE, message: `the locked content of "${name}" is not in the git history of ${entry.file}; give --from <git-rev>` }]);
    rev = found.value;
  }
  // A table new since that revision: every row is added.
  const listed = await tableListedAtRevision(ctx.root, rev, name, after.origin);
  if (!listed.ok) return problems(ctx.io, listed.problems);
  if (!listed.value) {
    const d: TableDiff = { ...emptyDiff(after), versionBefore: "(none)", columnsAdded: [...after.columns], added: [...after.keys()] };
    ctx.io.stdout(values.json ? JSON.stringify({ ...d, from: rev }, null, 2) + "\n" : renderDiff(d, rev));
    return PASS;
  }
  const before = await tableAtRevision(ctx.root, rev, name, after.origin);
  if (!before.ok) return problems(ctx.io, before.problems);
  const d = diffTables(before.value, after);
  ctx.io.stdout(values.json ? JSON.stringify({ ...d, from: rev }, null, 2) + "\n" : renderDiff(d, rev));
  return PASS;
};

function emptyDiff(t: RefTable): TableDiff {
  return { table: t.name, versionBefore: t.version, versionAfter: t.version, columnsAdded: [], columnsRemoved: [], added: [], removed: [], changed: [] };
}

/** A diff for people: one line per key, + added, - removed, ~ changed with its cells. */
function renderDiff(d: TableDiff, rev: string): string {
  const lines = [`${d.table}: ${rev.slice(0, 12)} (${d.versionBefore}) -> working copy (${d.versionAfter})`];
  if (isEmptyDiff(d)) lines.push("no row or column changes");
  if (d.columnsAdded.length > 0) lines.push(`columns added: ${d.columnsAdded.join(", ")}`);
  if (d.columnsRemoved.length > 0) lines.push(`columns removed: ${d.columnsRemoved.join(", ")}`);
  for (const k of d.added) lines.push(`+ ${k}`);
  for (const k of d.removed) lines.push(`- ${k}`);
  for (const c of d.changed) lines.push(`~ ${c.key}: ${c.changes.map((x) => `${x.column} ${JSON.stringify(x.before)} -> ${JSON.stringify(x.after)}`).join("; ")}`);
  lines.push(`${d.added.length} added, ${d.removed.length} removed, ${d.changed.length} changed`);
  return lines.join("\n") + "\n";
}

function wholeNumber(text: string, min: number): number | undefined {
  const n = Number(text);
  return /^[0-9]+$/.test(text) && n >= min ? n : undefined;
}


/** Left-aligned columns separated by two spaces, one line per row. */
function columns(table: readonly (readonly string[])[]): string {
  const rows = table.map((r) => r.map(oneLine));
  const widths: number[] = [];
  for (const r of rows) r.forEach((c, i) => (widths[i] = Math.max(widths[i] ?? 0, c.length)));
  return rows.map((r) => r.map((c, i) => (i === r.length - 1 ? c : c.padEnd(widths[i] ?? 0))).join("  ").trimEnd()).join("\n") + "\n";
}

const impact: Sub = async (positionals, values, ctx) => {
  const [name] = positionals;
  if (name === undefined || positionals.length > 1) return bad(ctx.io, "ref impact needs one table name");
  const maxFindings = wholeNumber(values["max-findings"] ?? "100000", 1);
  if (maxFindings === undefined) return bad(ctx.io, "--max-findings takes a whole number from 1");
  if (values.contract !== undefined && (values.data ?? []).length === 0) return bad(ctx.io, "--contract names the contract for the --data files; give --data <glob> too");
  const reg = await registryOr(ctx);
  if (typeof reg === "number") return reg;
  const broken = whenBroken(ctx, reg, name);
  if (broken !== undefined) return broken;
  let config = ctx.config;
  if (!config) {
    const loaded = await loadProjectConfig(ctx.root);
    if (!loaded.ok) return problems(ctx.io, loaded.problems);
    config = loaded.value;
  }
  const contract = values.contract === undefined ? undefined : reportPath(ctx.root, isAbsolute(values.contract) ? values.contract : join(ctx.io.cwd, values.contract));
  const r = await tableImpact(ctx.root, name, {
    registry: reg,
    config,
    data: (values.data ?? []).map((g) => g.replace(/^(\.\/)+/, "")),
    ...(contract === undefined ? {} : { contract }),
    ...(values.from === undefined ? {} : { from: values.from }),
    maxFindings,
  });
  if (!r.ok) return problems(ctx.io, r.problems);
  ctx.io.stdout(values.json ? JSON.stringify(impactJson(r.value), null, 2) + "\n" : renderImpact(r.value));
  return breaks(r.value) ? FAIL : PASS;
};

/** The impact report as JSON: snake_case like the delivery report. */
function impactJson(r: ImpactReport): unknown {
  return {
    table: r.table,
    working: r.working,
    locked: r.locked ?? null,
    ...(r.lockedProblem ? { locked_problem: formatProblem(r.lockedProblem) } : {}),
    contracts: r.contracts.map((c) => ({
      path: c.path,
      ...(c.name === undefined ? {} : { name: c.name }),
      checks: c.readers.map((x) => ({ via: x.via, rules: x.rules, ...(x.column === undefined ? {} : { column: x.column }), line: x.line, column_in_file: x.col })),
      compiles_now: c.compilesNow,
      compiles_locked: c.compilesLocked ?? null,
      problems: c.problems.map(formatProblem),
    })),
    deliveries: r.deliveries.map((d) => ({ path: d.path, contract: d.contract, rows: d.rows, fails_now: d.failsNow, passes_now: d.passesNow, truncated: d.truncated })),
    skipped: r.skipped,
    breaks: breaks(r),
  };
}

/** One changed finding: where, which check, and the cell (a rule's value already names its cells). */
function rowLine(c: RowChange): string {
  const where = c.row === undefined ? "" : c.line === undefined ? `row ${c.row}` : `row ${c.row} (line ${c.line})`;
  const whole = c.rule.startsWith("rule:") || c.rule.startsWith("group:");
  const level = c.level === "error" ? "" : `(${c.level})`;
  const cell = c.value === undefined ? c.column ?? "" : whole || c.column === undefined ? c.value : `${c.column} = ${JSON.stringify(c.value)}`;
  return `      ${[where, c.rule, cell, level].filter((x) => x !== "").join("  ")}`;
}

const plural = (n: number, word: string): string => `${n} ${word}${n === 1 ? "" : "s"}`;

/** The impact report for people: contracts and their checks, then each delivery's changed rows. */
function renderImpact(r: ImpactReport): string {
  const lines: string[] = [];
  const lockedText = r.locked ? (r.locked.revision === "lock" ? `lock (${r.locked.version})` : `${r.locked.revision.slice(0, 12)} (${r.locked.version})`) : "locked version not at hand";
  lines.push(`${r.table}: ${lockedText} -> working copy (${r.working.version})${r.locked?.same ? ", same content" : ""}`);
  if (r.lockedProblem) lines.push(`  (${formatProblem(r.lockedProblem)})`);
  lines.push(r.contracts.length === 0 ? "no contract reads this table" : `contracts reading ${r.table}:`);
  for (const c of r.contracts) {
    lines.push(`  ${c.path}${c.compilesNow ? "" : c.compilesLocked ? "  BREAKS: compiled with the locked table, not with the working copy" : "  does not compile"}`);
    for (const x of c.readers) lines.push(`    ${x.rules.join(", ")}  (${x.via}, line ${x.line})`);
    for (const p of c.problems) lines.push(`    ${formatProblem(p)}`);
  }
  if (r.deliveries.length + r.skipped.length > 0) lines.push("deliveries:");
  for (const d of r.deliveries) {
    const summary = d.failsNow.length + d.passesNow.length === 0 ? "no change" : `${d.failsNow.length} newly failing, ${d.passesNow.length} newly passing`;
    lines.push(`  ${d.path} (${d.contract}, ${plural(d.rows, "row")}): ${summary}${d.truncated ? " (findings cut; raise --max-findings)" : ""}`);
    if (d.failsNow.length > 0) lines.push("    fails now, passed under the lock:", ...d.failsNow.map(rowLine));
    if (d.passesNow.length > 0) lines.push("    passes now, failed under the lock:", ...d.passesNow.map(rowLine));
  }
  for (const s of r.skipped) lines.push(`  ${s.path}: not checked (${s.reason.replaceAll("-", " ")}${s.contract === undefined ? "" : `: ${s.contract}`})`);
  if (r.deliveries.length + r.skipped.length === 0 && r.locked && !r.locked.same) lines.push("give --data <glob> to see which delivery rows change");
  if (r.deliveries.length > 0) {
    const fails = r.deliveries.reduce((n, d) => n + d.failsNow.length, 0);
    const passes = r.deliveries.reduce((n, d) => n + d.passesNow.length, 0);
    lines.push(`${plural(fails, "finding")} newly failing (passed under the lock), ${passes} newly passing (failed under the lock)`);
  }
  return lines.join("\n") + "\n";
}

const SUBS: Readonly<Record<string, Sub>> = { list, show, lint, lock, diff, impact };
const TAKES_NO_TABLE: ReadonlySet<string> = new Set(["list", "lint", "lock"]);

/**
 * `tablegate ref ...`: list, show, lint, lock and diff the registry. Returns the exit status: 0 done,
 * 1 lint found problems, 2 bad arguments or a registry that cannot be loaded.
 */
export async function runRef(args: readonly string[], io: RefIo, options: RefOptions = {}): Promise<number> {
  const [subName, ...rest] = args;
  if (subName === "--help" || subName === "-h" || subName === "help") return showUsage(io, REF_USAGE);
  const sub = subName === undefined ? undefined : Object.hasOwn(SUBS, subName) ? SUBS[subName] : undefined;
  if (!sub) return bad(io, `${subName === undefined ? "ref needs a subcommand" : `unknown ref subcommand "${subName}"`}; expected one of ${Object.keys(SUBS).join(", ")}`);
  const parsed = commandArgs(io, "ref", rest, {
    json: { type: "boolean" },
    from: { type: "string" },
    page: { type: "string" },
    "page-size": { type: "string" },
    data: { type: "string", multiple: true },
    contract: { type: "string" },
    "max-findings": { type: "string" },
    report: { type: "string", multiple: true },
    help: { type: "boolean", short: "h" },
  });
  if (typeof parsed === "number") return parsed;
  if (parsed.values.help === true) return showUsage(io, REF_USAGE);
  // list, lint and lock name no table: a word after them is a mistake, not something to ignore.
  if (TAKES_NO_TABLE.has(subName as string) && parsed.positionals.length > 0) return bad(io, `ref ${subName} takes no table name, got ${parsed.positionals.map((p) => JSON.stringify(p)).join(", ")}`);
  return sub(parsed.positionals, parsed.values, { io, root: findRoot(io.cwd), roots: options.registries ?? [], ...(options.config ? { config: options.config } : {}) });
}

/** `tablegate ref ...` as a CLI command: reads tablegate.yaml for further registries, then runs `runRef`. */
export async function ref(argv: readonly string[], io: Io): Promise<number> {
  const config = await loadProjectConfig(findRoot(io.cwd));
  if (!config.ok) return problems(io, config.problems);
  return runRef(argv, io, { registries: config.value.registries, config: config.value });
}
