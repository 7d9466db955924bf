import { CHECKS, type CheckContext } from "../checks/index.js";
import { compileExpression, type CompiledExpr, type ReferenceLookup } from "../expr/index.js";
import { typedCell } from "../registry/typed-cell.js";
import type { Problem } from "../problem.js";
import type { Registry } from "../registry/index.js";
import { compareValues, compileType, parseBound, todayDays } from "../types/index.js";
import { suggestion } from "./near-miss.js";
import type { CellCheckPlan, CheckMeta, ColumnPlan, FileChecks, GroupPlan, KeyPlan, OutlierPlan, Plan, RulePlan } from "./plan.js";
import type { SpecError } from "./spec-error.js";
import type { ColumnSpec, ColumnType, ContractSpec, Level } from "./types.js";
import { problemAt, type YamlPath, type YamlSource } from "./yaml-source.js";
import { isScalar } from "yaml";

/** Options each type's parser reads, besides the checks. */
const PARSER_OPTIONS: Readonly<Record<ColumnType, readonly string[]>> = {
  text: [],
  integer: ["thousands"],
  decimal: ["thousands", "decimal_mark", "percent"],
  boolean: ["values"],
  date: ["format"],
  timestamp: ["format", "timezone"],
  time: ["format"],
};
const COMMON_OPTIONS = new Set(["type", "description", "required", "level", "allow", "sensitive", "spaces", "when"]);
const LEVEL_ORDER: Readonly<Record<Level, number>> = { note: 0, warning: 1, error: 2 };

export interface CompileInput {
  readonly src: YamlSource;
  readonly spec: ContractSpec;
  readonly sha256: string;
  readonly registry: Registry;
  /** Fixed clock for `not_future`, days since 1970-01-01. */
  readonly today?: number;
}

const DECIMAL_TEXT = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** The source text of a number scalar when it differs from the double YAML read (see CheckContext). */
function writtenNumber(src: YamlSource, path: YamlPath): string | undefined {
  const node = src.doc.getIn(path, true);
  if (!isScalar(node) || typeof node.value !== "number" || !node.range) return undefined;
  const text = src.text.slice(node.range[0], node.range[1]).trim();
  return DECIMAL_TEXT.test(text) && text !== String(node.value) ? text : undefined;
}

/** Compile a schema-valid contract into a plan, or every problem found, each at file:line:col. */
export function compilePlan({ src, spec, sha256, registry, today = todayDays() }: CompileInput): { plan?: Plan; problems: Problem[] } {
  const problems: Problem[] = [];
  const report = (base: YamlPath, errors: readonly SpecError[]) => {
    for (const e of errors) problems.push(problemAt(src, [...base, ...e.path], e.message, e.offset === undefined ? {} : { offset: e.offset }));
  };
  const checks: CheckMeta[] = [];
  const addCheck = (rule: string, level: Level, description: string, at?: { path: YamlPath; key?: string }, allow?: number): number => {
    const pos = at ? problemAt(src, at.path, "", at.key === undefined ? {} : { key: at.key }) : undefined;
    const source = pos?.line === undefined ? undefined : { line: pos.line, column: pos.column ?? 1 };
    // A rule id names one check (SPEC 1.2): two rules, groups, keys or outlier entries sharing one are a mistake.
    const earlier = checks.find((c) => c.rule === rule);
    if (earlier !== undefined && at !== undefined) {
      problems.push(problemAt(src, at.path, `the check ${rule} is already declared${earlier.source ? ` at line ${earlier.source.line}` : ""}; give each its own id`, at.key === undefined ? {} : { key: at.key }));
    }
    checks.push({ rule, level, description, ...(source ? { source } : {}), ...(allow === undefined ? {} : { allow }) });
    return checks.length - 1;
  };

  const header = spec.input?.header ?? "exact";
  const policyPath: YamlPath = spec.input?.header === undefined ? ["columns"] : ["input", "header"];
  const file: FileChecks = {
    structure: addCheck("file.structure", "error", "the file can be read to its end"),
    width: addCheck("row.width", "error", "every record has as many cells as the header"),
    headerMissing: addCheck("header.missing", "error", "the header names every declared column", { path: ["columns"] }),
    // Whether extra or reordered columns count is the header policy's doing: point there when it is written.
    headerUnexpected: addCheck("header.unexpected", header === "exact" ? "error" : "note", "the header names only declared columns", { path: policyPath }),
    headerOrder: addCheck("header.order", "error", "the header lists the columns in declared order", { path: policyPath }),
    headerDuplicate: addCheck("header.duplicate", "error", "no header name appears twice", { path: ["columns"] }),
  };

  const input = spec.input ?? {};
  const format = input.format ?? "csv";
  // SPEC: delimiter and quote are csv only; a TSV splits on tabs and never quotes, NDJSON has neither.
  for (const key of ["delimiter", "quote"] as const) {
    if (format !== "csv" && input[key] !== undefined) problems.push(problemAt(src, ["input"], `option "${key}" applies to csv input only; a ${format} file ${format === "tsv" ? "splits on tabs and has no quoting" : "has one JSON object per line"}`, { key }));
    // A line break or NUL cannot separate fields or quote them: records end at line breaks.
    const c = input[key];
    if (c !== undefined && /[\r\n\0]/.test(c)) problems.push(problemAt(src, ["input"], `${key} cannot be a line break or NUL`, { key }));
  }
  if (format === "csv" && (input.delimiter ?? ",") === (input.quote ?? '"')) {
    problems.push(problemAt(src, ["input"], `delimiter and quote are both ${JSON.stringify(input.quote ?? '"')}; a field could not tell where it ends`, { key: input.quote !== undefined ? "quote" : "delimiter" }));
  }

  const names = Object.keys(spec.columns);
  const columnIndex = (name: string): number | undefined => {
    const i = names.indexOf(name);
    return i < 0 ? undefined : i;
  };
  const usedTables = new Set<string>();
  // A table the registry declares but could not load blocks only the contracts that name it.
  const brokenReason = (name: string): string | undefined => {
    const found = registry.broken?.().get(name);
    const first = found?.[0];
    if (first === undefined) return undefined;
    const where = `${first.file}${first.line === undefined ? "" : `:${first.line}`}`;
    return `reference table "${name}" cannot be used: ${where}: ${first.message}${found !== undefined && found.length > 1 ? ` (and ${found.length - 1} more; tablegate ref lint lists them)` : ""}`;
  };
  const lookupTable = (name: string): ReferenceLookup | undefined => {
    const t = registry.table(name);
    if (!t) return undefined;
    usedTables.add(name);
    return {
      columns: t.columns,
      get: (key, column) => {
        const cell = t.get(key, column);
        return cell === null ? null : typedCell(t.types[column], cell);
      },
    };
  };
  /** `groupBy` compiles a group assert: aggregates allowed, and those columns bare. */
  const compileExpr = (text: string, path: YamlPath, groupBy?: readonly number[]): CompiledExpr | undefined => {
    const group = groupBy === undefined ? {} : { aggregates: true, groupBy };
    const r = compileExpression(text, { column: columnIndex, table: lookupTable, tableTrouble: brokenReason, ...group, columnNames: names, columnType: (i) => spec.columns[names[i] ?? ""]?.type });
    if (r.ok) return r.expr;
    problems.push(problemAt(src, path, r.message, { offset: r.offset }));
    return undefined;
  };
  const needColumn = (name: string, path: YamlPath): number | undefined => {
    const i = columnIndex(name);
    if (i === undefined) problems.push(problemAt(src, path, `unknown column "${name}"${suggestion(name, names)}; declared: ${names.join(", ")}`));
    return i;
  };

  const columns: ColumnPlan[] = [];
  names.forEach((name, index) => {
    const col = spec.columns[name] as ColumnSpec;
    const base: YamlPath = ["columns", name];
    const level = col.level ?? "error";
    const allow = col.allow;
    const at = (key: string) => ({ path: base, key });
    for (const key of Object.keys(col)) {
      if (COMMON_OPTIONS.has(key) || PARSER_OPTIONS[col.type].includes(key)) continue;
      const def = CHECKS[key];
      // Anything else is an option of another type (percent on an integer) or a check that does not apply.
      if (key === "postal" ? col.type !== "text" : !def || !def.types.includes(col.type)) {
        const fits = Object.entries(PARSER_OPTIONS).filter(([, o]) => o.includes(key)).map(([t]) => t);
        const types = def ? [...new Set([...def.types, ...fits])] : fits;
        problems.push(problemAt(src, base, `option "${key}" does not apply to ${/^[aeiou]/.test(col.type) ? "an" : "a"} ${col.type} column; it applies to ${types.join(", ")}`, { key }));
      }
    }
    const typed = compileType(col);
    if (!typed.ok) report(base, typed.errors);
    // Limits no value can meet are a mistake in the contract, not in every row of the delivery.
    if (col.min !== undefined && col.max !== undefined) {
      const lo = parseBound(col, col.min);
      const hi = parseBound(col, col.max);
      const order = lo === undefined || hi === undefined ? null : compareValues(lo, hi);
      if (order !== null && order > 0) problems.push(problemAt(src, base, `max ${String(col.max)} is below min ${String(col.min)}: no value could pass`, { key: "max" }));
    }
    if (col.min_length !== undefined && col.max_length !== undefined && col.min_length > col.max_length) {
      problems.push(problemAt(src, base, `max_length ${col.max_length} is below min_length ${col.min_length}: no value could pass`, { key: "max_length" }));
    }
    const ctx: CheckContext = {
      column: name,
      columnIndex,
      columnNames: names,
      sensitive: (other) => spec.columns[other]?.sensitive === true,
      today,
      writtenNumber: (path) => writtenNumber(src, [...base, ...path]),
      codeSet: (table, column) => {
        const t = registry.table(table);
        if (!t) return { field: "table", message: brokenReason(table) ?? `unknown reference table "${table}"${suggestion(table, registry.tables().map((x) => x.name))}; tables: ${registry.tables().map((x) => x.name).join(", ")}` };
        const values = t.values(column);
        if (!values) return { field: "column", message: `reference table "${table}" has no column "${column}"${suggestion(column, t.columns)}; columns: ${t.columns.join(", ")}` };
        usedTables.add(table);
        return values;
      },
    };
    const cellChecks: CellCheckPlan[] = [];
    for (const def of Object.values(CHECKS)) {
      if (col[def.key] === undefined || !def.types.includes(col.type)) continue;
      const compiled = def.compile(col, ctx);
      if (compiled === undefined) continue;
      if (Array.isArray(compiled)) report(base, compiled);
      else cellChecks.push({ check: addCheck(`${name}.${def.name}`, level, compiled.description, at(def.key), allow), test: compiled.test });
    }
    const expected = typed.ok ? typed.parser.expected : "";
    const spacesLevel: Level = LEVEL_ORDER[level] < LEVEL_ORDER.warning ? level : "warning";
    columns.push({
      name,
      index,
      type: col.type,
      spec: col,
      parse: typed.ok ? typed.parser.parse : () => undefined,
      expected,
      required: col.required === true,
      sensitive: col.sensitive === true,
      typeCheck: addCheck(`${name}.type`, level, `${name} is ${expected}`, at("type"), allow),
      requiredCheck: addCheck(`${name}.required`, level, `${name} is not blank`, at(col.required ? "required" : "type"), allow),
      spacesCheck: col.spaces === "allow" ? -1 : addCheck(`${name}.spaces`, spacesLevel, `${name} has no leading or trailing spaces`, { path: ["columns"], key: name }),
      cellChecks,
      ...(col.when === undefined ? {} : { when: compileExpr(col.when, [...base, "when"]) }),
    });
  });

  const keys: KeyPlan[] = [];
  (spec.keys ?? []).forEach((entry, i) => {
    const list = typeof entry === "string" ? [entry] : [...entry];
    const path: YamlPath = ["keys", i];
    const idx = list.map((c, j) => needColumn(c, typeof entry === "string" ? path : [...path, j]));
    if (idx.some((x) => x === undefined)) return;
    const again = list.findIndex((c, j) => list.indexOf(c) !== j);
    if (again >= 0) {
      problems.push(problemAt(src, [...path, again], `column "${list[again]}" appears twice in this key`));
      return;
    }
    keys.push({ check: addCheck(`key:${list.join("+")}`, "error", `${list.join(" + ")} is unique`, { path }), columns: idx as number[] });
  });

  const dup = spec.duplicates ?? "error";
  const duplicates = dup === "off"
    ? undefined
    : addCheck("duplicates", typeof dup === "string" ? dup : dup.level, "no row repeats another exactly", spec.duplicates === undefined ? undefined : { path: [], key: "duplicates" }, typeof dup === "string" ? undefined : dup.allow);

  const rules: RulePlan[] = [];
  (spec.rules ?? []).forEach((r, i) => {
    const path: YamlPath = ["rules", i];
    const assert = compileExpr(r.assert, [...path, "assert"]);
    const when = r.when === undefined ? undefined : compileExpr(r.when, [...path, "when"]);
    if (!assert || (r.when !== undefined && !when)) return;
    const description = r.description ?? (r.when ? `${r.assert} when ${r.when}` : r.assert);
    rules.push({ check: addCheck(`rule:${r.id}`, r.level ?? "error", description, { path }, r.allow), assert, ...(when ? { when } : {}), ...(r.message ? { message: r.message } : {}) });
  });

  const groups: GroupPlan[] = [];
  (spec.groups ?? []).forEach((g, i) => {
    const path: YamlPath = ["groups", i];
    const byNames = typeof g.by === "string" ? [g.by] : [...g.by];
    const by = byNames.map((c, j) => needColumn(c, typeof g.by === "string" ? [...path, "by"] : [...path, "by", j]));
    const assert = compileExpr(g.assert, [...path, "assert"], by.filter((x) => x !== undefined));
    const when = g.when === undefined ? undefined : compileExpr(g.when, [...path, "when"]);
    if (!assert || by.some((x) => x === undefined) || (g.when !== undefined && !when)) return;
    const description = g.description ?? `per ${byNames.join(" + ")}: ${g.assert}`;
    groups.push({ check: addCheck(`group:${g.id}`, g.level ?? "error", description, { path }, g.allow), id: g.id, by: by as number[], assert, ...(when ? { when } : {}), ...(g.message ? { message: g.message } : {}) });
  });

  const outliers: OutlierPlan[] = [];
  (spec.outliers ?? []).forEach((o, i) => {
    const path: YamlPath = ["outliers", i];
    const column = needColumn(o.column, [...path, "column"]);
    if (column === undefined) return;
    const type = spec.columns[o.column]?.type;
    if (type !== "integer" && type !== "decimal") {
      problems.push(problemAt(src, [...path, "column"], `outliers need an integer or decimal column; ${o.column} is ${type}`));
      return;
    }
    const k = o.k ?? 1.5;
    const threshold = o.threshold ?? 3.5;
    const description = o.method === "tukey" ? `${o.column} within Tukey fences (k = ${k})` : `${o.column} modified z-score at most ${threshold}`;
    outliers.push({ check: addCheck(`outlier:${o.column}`, o.level ?? "warning", description, { path }, o.allow), column, method: o.method, k, threshold });
  });

  const rowsSpec = spec.totals?.rows;
  if (rowsSpec?.min !== undefined && rowsSpec.max !== undefined && rowsSpec.min > rowsSpec.max) {
    problems.push(problemAt(src, ["totals", "rows"], `max ${rowsSpec.max} is below min ${rowsSpec.min}: no file could pass`, { key: "max" }));
  }
  const totalRows = rowsSpec
    ? {
        check: addCheck("totals.rows", rowsSpec.level ?? "error", `between ${rowsSpec.min ?? 0} and ${rowsSpec.max ?? "any number of"} rows`, { path: ["totals"], key: "rows" }),
        ...(rowsSpec.min === undefined ? {} : { min: rowsSpec.min }),
        ...(rowsSpec.max === undefined ? {} : { max: rowsSpec.max }),
      }
    : undefined;
  const blankShares = Object.entries(spec.totals?.blank_share ?? {}).flatMap(([name, max]) => {
    const column = columnIndex(name);
    if (column === undefined) problems.push(problemAt(src, ["totals", "blank_share"], `unknown column "${name}"${suggestion(name, names)}; declared: ${names.join(", ")}`, { key: name }));
    if (column === undefined) return [];
    return [{ check: addCheck(`totals.blank_share.${name}`, "error", `at most ${max * 100}% of ${name} blank`, { path: ["totals", "blank_share"], key: name }), column, max }];
  });

  if (problems.length > 0) return { problems };
  const references = [...usedTables].sort().map((name) => {
    const t = registry.table(name);
    return { table: name, version: t?.version ?? "", sha256: t?.sha256 ?? "" };
  });
  const plan: Plan = {
    name: spec.name,
    ...(spec.version === undefined ? {} : { version: spec.version }),
    path: src.file,
    sha256,
    input: {
      format,
      delimiter: input.delimiter ?? (format === "tsv" ? "\t" : ","),
      quote: input.quote ?? '"',
      encoding: input.encoding ?? "utf-8",
      header,
      blank: new Set(["", ...(input.blank ?? []).map((b) => b.trim())]),
    },
    columns,
    checks,
    file,
    keys,
    ...(duplicates === undefined ? {} : { duplicates }),
    rules,
    groups,
    outliers,
    ...(totalRows ? { totalRows } : {}),
    blankShares,
    references,
  };
  return { plan, problems };
}
