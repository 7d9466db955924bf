/**
 * Compiles a parsed expression into closures, once: names are resolved, static types checked where
 * they are known, literals pre-cast, LIKE patterns and regexes built. Evaluating a row then runs only
 * closures, without looking at the tree. NULL propagates as in ISO/IEC 9075 three-valued logic.
 */
import type { Value } from "../values.js";
import type { Node, NodeOf } from "./ast.js";
import { textToBoolean, textToNumber, valueToText } from "./coerce.js";
import { compareValues, textLiteralComparer } from "./compare.js";
import { parseIsoDate, parseIsoTime, parseIsoTimestamp } from "./dates.js";
import { AGGREGATES, FUNCTIONS, SPECIAL_FUNCTIONS } from "./functions.js";
import { add, divide, multiply, negate, remainder, subtract } from "./arithmetic.js";
import { compileLike } from "./like.js";
import { KEYWORDS } from "./lexer.js";
import { and, between, comparison, membership, not, or, searchedCase, simpleCase, type Against } from "./predicates.js";
import { parse } from "./parser.js";
import { MAX_RECORD_SIZE } from "../input/types.js";
import { compileSafeRegex } from "../safe-regex.js";
import { nearest } from "./suggest.js";
import type { AggregateCall, CompileResult, CompiledExpr, Eval, ExprEnv, ExprType } from "./types.js";
import { comparable, typeName, typeOfColumn, unify } from "./typing.js";
import { dateValue, timeValue, timestampValue } from "../values.js";

/** A compiled sub-expression: its closure, static type, and its value when known at compile time. */
interface C {
  readonly fn: Eval;
  readonly type: ExprType;
  readonly node: Node;
  readonly constant: boolean;
  readonly value: Value;
}


const TESTS: Readonly<Record<string, (c: number) => boolean>> = {
  "=": (c) => c === 0,
  "<>": (c) => c !== 0,
  "<": (c) => c < 0,
  "<=": (c) => c <= 0,
  ">": (c) => c > 0,
  ">=": (c) => c >= 0,
};

const ARITHMETIC: Readonly<Record<string, (a: Value, b: Value) => Value>> = {
  "+": add,
  "-": subtract,
  "*": multiply,
  "/": divide,
  "%": remainder,
};

const NO_ROW: readonly Value[] = [];

/** Compile `source` against `env`: a closure-backed expression, or the offset and message of the first error. */
export function compileExpression(source: string, env: ExprEnv): CompileResult {
  const parsed = parse(source);
  if (!parsed.ok) return { ok: false, offset: parsed.offset, message: parsed.message };
  const compiler = makeCompiler(source, env);
  const top = compiler.compile(parsed.node);
  const failure = compiler.failure();
  if (top === null || failure !== null) return failure ?? { ok: false, offset: 0, message: "cannot compile the expression" };
  if (top.type !== "boolean" && top.type !== "any") {
    return { ok: false, offset: top.node.start, message: `expected a condition (true or false), found ${typeName(top.type)}; compare it, for example x > 0 or x IS NOT NULL` };
  }
  return { ok: true, expr: { source, columns: compiler.columns, evaluate: top.fn, aggregates: compiler.aggregates } };
}

function makeCompiler(source: string, env: ExprEnv) {
  const columns: number[] = [];
  const aggregates: AggregateCall[] = [];
  const aggregateKeys: string[] = [];
  let argColumns: number[] | null = null;
  let failure: { ok: false; offset: number; message: string } | null = null;

  const fail = (offset: number, message: string): null => {
    failure ??= { ok: false, offset, message };
    return null;
  };
  const text = (n: Node): string => source.slice(n.start, n.end);
  const dynamic = (node: Node, type: ExprType, fn: Eval): C => ({ fn, type, node, constant: false, value: null });
  const constant = (node: Node, type: ExprType, value: Value): C => ({ fn: () => value, type, node, constant: true, value });
  /** Fold a node whose inputs are all constant into its value. */
  const folded = (node: Node, type: ExprType, fn: Eval, parts: readonly C[]): C =>
    parts.every((p) => p.constant) ? constant(node, type, fn(NO_ROW)) : dynamic(node, type, fn);

  /** Source offset of character `index` of a text literal's contents ('' counts as one character). */
  function contentOffset(lit: Node, index: number): number {
    let at = lit.start + 1;
    for (let k = 0; k < index && at < lit.end - 1; k++) at += source[at] === "'" ? 2 : 1;
    return at;
  }

  function noteColumn(i: number): void {
    if (!columns.includes(i)) columns.push(i);
    if (argColumns !== null && !argColumns.includes(i)) argColumns.push(i);
  }

  const display = (name: string): string =>
    /^[\p{L}_][\p{L}\p{N}_$]*$/u.test(name) && !KEYWORDS.has(name.toUpperCase()) ? name : `"${name.replaceAll('"', '""')}"`;

  function unknownColumn(node: NodeOf<"column">): null {
    let message = `unknown column ${display(node.name)}`;
    const joined = node.quoted ? null : /^[\p{L}\p{N}_$-]+/u.exec(source.slice(node.start))?.[0];
    if (joined !== undefined && joined !== null && joined !== node.name && env.column(joined) !== undefined) {
      message += `; a name with '-' must be double-quoted: "${joined}"`;
    } else {
      const guess = env.columnNames === undefined ? undefined : nearest(node.name, env.columnNames);
      if (guess !== undefined) message += `; did you mean ${display(guess)}?`;
      else if (!node.quoted && FUNCTIONS[node.name.toLowerCase()] !== undefined) message += `; to call the function write ${node.name}(...)`;
    }
    return fail(node.start, message);
  }

  function needType(c: C, allowed: readonly ExprType[], what: string): boolean {
    if (c.type === "any" || c.type === "null" || allowed.includes(c.type)) return true;
    fail(c.node.start, `${what}, found ${typeName(c.type)}`);
    return false;
  }

  /** When a text literal meets a typed value, the literal must cast to that type (checked once, here). */
  function checkCast(lit: C, other: ExprType): boolean {
    if (!lit.constant || typeof lit.value !== "string") return true;
    const v = lit.value;
    const bad =
      (other === "number" && textToNumber(v) === null) ||
      (other === "date" && parseIsoDate(v) === null) ||
      (other === "timestamp" && parseIsoTimestamp(v) === null) ||
      (other === "time" && parseIsoTime(v) === null) ||
      (other === "boolean" && textToBoolean(v) === null);
    if (!bad) return true;
    const form = { number: "a number", date: "a date 'YYYY-MM-DD'", timestamp: "a timestamp 'YYYY-MM-DDTHH:MM:SS'", time: "a time 'HH:MM:SS'", boolean: "true or false" }[other as "date"];
    fail(lit.node.start, `'${v}' is compared with ${typeName(other)}, so it must be ${form}`);
    return false;
  }

  function checkComparable(a: C, b: C, at: number): boolean {
    if (!comparable(a.type, b.type)) {
      fail(at, `cannot compare ${typeName(a.type)} with ${typeName(b.type)}`);
      return false;
    }
    return checkCast(a, b.type) && checkCast(b, a.type);
  }

  /** A function comparing a value with `c`'s value, with text literals pre-cast. */
  function against(c: C): Against {
    if (c.constant) {
      if (typeof c.value === "string") {
        const cmp = textLiteralComparer(c.value);
        return (a) => cmp(a);
      }
      const v = c.value;
      return (a) => compareValues(a, v);
    }
    const f = c.fn;
    return (a, r) => compareValues(a, f(r));
  }

  function compile(node: Node): C | null {
    switch (node.type) {
      case "number":
        return constant(node, "number", node.value);
      case "text":
        return constant(node, "text", node.value);
      case "boolean":
        return constant(node, "boolean", node.value);
      case "null":
        return constant(node, "null", null);
      case "typed":
        return compileTyped(node);
      case "column":
        return compileColumn(node);
      case "call":
        return compileCall(node);
      case "unary":
        return compileUnary(node);
      case "binary":
        return node.op === "||" ? compileConcat(node) : node.op in TESTS ? compileComparison(node) : compileArithmetic(node);
      case "logical":
        return compileLogical(node);
      case "is":
        return compileIs(node);
      case "distinct":
        return compileDistinct(node);
      case "between":
        return compileBetween(node);
      case "in":
        return compileIn(node);
      case "like":
        return compileLikeNode(node);
      case "case":
        return compileCase(node);
    }
  }

  function compileTyped(node: NodeOf<"typed">): C | null {
    const t = node.text.value;
    if (node.kind === "date") {
      const days = parseIsoDate(t);
      return days === null ? fail(node.text.start, `'${t}' is not a valid date; expected DATE 'YYYY-MM-DD' with a real day of the month`) : constant(node, "date", dateValue(days));
    }
    if (node.kind === "time") {
      const s = parseIsoTime(t);
      return s === null ? fail(node.text.start, `'${t}' is not a valid time; expected TIME 'HH:MM' or 'HH:MM:SS'`) : constant(node, "time", timeValue(s));
    }
    const ts = parseIsoTimestamp(t);
    return ts === null
      ? fail(node.text.start, `'${t}' is not a valid timestamp; expected TIMESTAMP 'YYYY-MM-DDTHH:MM:SS' with an optional Z or ±HH:MM`)
      : constant(node, "timestamp", timestampValue(ts.ms, ts.zoned));
  }

  function compileColumn(node: NodeOf<"column">): C | null {
    if (env.aggregates === true && argColumns === null) {
      const n = display(node.name);
      const i = env.column(node.name);
      // As in SQL HAVING, a column the group is formed by has one value per group: its first row's.
      if (i !== undefined && env.groupBy?.includes(i) === true) {
        noteColumn(i);
        const arg: CompiledExpr = { source: n, columns: [i], evaluate: (r) => r[i] ?? null, aggregates: [] };
        return dynamic(node, typeOfColumn(env.columnType?.(i)), slotOf("first", arg));
      }
      const by = env.groupBy?.map((c) => env.columnNames?.[c]).filter((x) => x !== undefined) ?? [];
      return fail(node.start, `column ${n} is outside an aggregate; a group assert reads columns through sum(${n}), count(${n}), min(${n}), max(${n}) or first(${n})${by.length > 0 ? `, and names bare only the columns it is grouped by (${by.join(", ")})` : ""}`);
    }
    const i = env.column(node.name);
    if (i === undefined) return unknownColumn(node);
    noteColumn(i);
    return dynamic(node, typeOfColumn(env.columnType?.(i)), (r) => r[i] ?? null);
  }

  function compileArgs(nodes: readonly Node[]): C[] | null {
    const out: C[] = [];
    for (const n of nodes) {
      const c = compile(n);
      if (c === null) return null;
      out.push(c);
    }
    return out;
  }

  function compileCall(node: NodeOf<"call">): C | null {
    const name = node.name.toLowerCase();
    if (AGGREGATES.includes(name)) return compileAggregate(node, name as AggregateCall["fn"]);
    if (name === "lookup") return compileLookup(node);
    if (name === "matches") return compileMatches(node);
    const def = FUNCTIONS[name];
    if (def === undefined) {
      const known = [...Object.keys(FUNCTIONS), ...SPECIAL_FUNCTIONS].sort();
      const guess = nearest(name, env.aggregates === true ? [...known, ...AGGREGATES] : known);
      return fail(node.start, `unknown function ${node.name}; expected one of ${known.join(", ")}${guess === undefined ? "" : ` (did you mean ${guess}?)`}`);
    }
    if (node.star) return fail(source.indexOf("*", node.nameEnd), `${name}(*) is not allowed; expected an argument`);
    if (node.args.length < def.min) return fail(node.end - 1, `${name}() needs ${def.min === def.max ? "" : "at least "}${def.min} argument${def.min === 1 ? "" : "s"}, found ${node.args.length}`);
    const extra = node.args[def.max];
    if (extra !== undefined) return fail(extra.start, `${name}() takes at most ${def.max} argument${def.max === 1 ? "" : "s"}`);
    const args = compileArgs(node.args);
    if (args === null) return null;
    for (let i = 0; i < args.length; i++) {
      const param = def.params[Math.min(i, def.params.length - 1)];
      if (param === "number" && !needType(args[i] as C, ["number"], `${name}() expects a number here`)) return null;
    }
    const type = def.result(args.map((a) => a.type));
    if (type === null) return fail(node.start, `${name}() arguments have types that do not mix (${args.map((a) => typeName(a.type)).join(", ")})`);
    return folded(node, type, def.build(args.map((a) => a.fn)), args);
  }

  function compileAggregate(node: NodeOf<"call">, fn: AggregateCall["fn"]): C | null {
    if (env.aggregates !== true) return fail(node.start, `${fn}() is an aggregate, allowed only in a group assert`);
    if (argColumns !== null) return fail(node.start, `${fn}() cannot be nested inside another aggregate`);
    const bare = node.star || node.args.length === 0;
    if (fn !== "count" && bare) return fail(node.star ? source.indexOf("*", node.nameEnd) : node.end - 1, `${fn}() needs one argument, a column or an expression over the row`);
    const extra = node.args[1];
    if (extra !== undefined) return fail(extra.start, `${fn}() takes one argument`);
    let arg: CompiledExpr | null = null;
    let argType: ExprType = "number";
    const argNode = node.args[0];
    if (!bare && argNode !== undefined) {
      argColumns = [];
      const c = compile(argNode);
      const read = argColumns;
      argColumns = null;
      if (c === null) return null;
      if (fn === "sum" && !needType(c, ["number"], "sum() adds numbers")) return null;
      argType = fn === "count" || fn === "sum" ? "number" : c.type;
      arg = { source: text(argNode), columns: read, evaluate: c.fn, aggregates: [] };
    }
    return dynamic(node, argType, slotOf(fn, arg));
  }

  /** The reader of an aggregate's result, the same slot for the same call written twice. */
  function slotOf(fn: AggregateCall["fn"], arg: CompiledExpr | null): (v: readonly Value[]) => Value {
    const key = `${fn}(${arg === null ? "" : arg.source.replace(/\s+/g, " ")})`;
    let k = aggregateKeys.indexOf(key);
    if (k < 0) {
      k = aggregates.length;
      aggregates.push({ fn, arg });
      aggregateKeys.push(key);
    }
    const slot = k;
    return (v) => v[slot] ?? null;
  }

  function compileLookup(node: NodeOf<"call">): C | null {
    const [tableNode, keyNode, columnNode] = node.args;
    if (node.args.length !== 3 || tableNode === undefined || keyNode === undefined || columnNode === undefined) {
      const at = node.args[3]?.start ?? node.end - 1;
      return fail(at, `lookup() takes 3 arguments, lookup('table', key, 'column'), found ${node.args.length}`);
    }
    if (tableNode.type !== "text") return fail(tableNode.start, "expected the table name as quoted text, like lookup('us-states', state, 'region')");
    const table = env.table(tableNode.value);
    if (table === undefined) return fail(tableNode.start, env.tableTrouble?.(tableNode.value) ?? `unknown reference table '${tableNode.value}'`);
    if (columnNode.type !== "text") return fail(columnNode.start, "expected the column name as quoted text, like lookup('us-states', state, 'region')");
    const ci = table.columns.indexOf(columnNode.value);
    if (ci < 0) {
      const guess = nearest(columnNode.value, table.columns);
      return fail(columnNode.start, `table '${tableNode.value}' has no column '${columnNode.value}'${guess === undefined ? "" : ` (did you mean '${guess}'?)`}; its columns are ${table.columns.join(", ")}`);
    }
    const key = compile(keyNode);
    if (key === null) return null;
    const k = key.fn;
    return dynamic(node, "any", (r) => {
      const v = k(r);
      if (v === null) return null;
      return table.get(typeof v === "string" ? v : (valueToText(v) as string), ci) ?? null;
    });
  }

  function compileMatches(node: NodeOf<"call">): C | null {
    const [subjectNode, patternNode] = node.args;
    if (node.args.length !== 2 || subjectNode === undefined || patternNode === undefined) {
      return fail(node.args[2]?.start ?? node.end - 1, `matches() takes 2 arguments, matches(text, 'regex'), found ${node.args.length}`);
    }
    if (patternNode.type !== "text") return fail(patternNode.start, "expected the regular expression as quoted text (it is compiled once, so it cannot come from the row)");
    // The same dialect and linear-time guarantee as a column's `pattern`.
    const re = compileSafeRegex(patternNode.value);
    if (!(re instanceof RegExp)) return fail(contentOffset(patternNode, re.offset), re.message);
    const subject = compile(subjectNode);
    if (subject === null) return null;
    const s = subject.fn;
    return folded(node, "boolean", (r) => {
      const v = s(r);
      if (v === null) return null;
      return re.test(typeof v === "string" ? v : (valueToText(v) as string));
    }, [subject]);
  }

  function compileUnary(node: NodeOf<"unary">): C | null {
    const operand = compile(node.operand);
    if (operand === null) return null;
    const f = operand.fn;
    if (node.op === "not") {
      if (!needType(operand, ["boolean"], "NOT needs a condition")) return null;
      return folded(node, "boolean", not(f), [operand]);
    }
    if (!needType(operand, ["number"], `unary ${node.op} needs a number`)) return null;
    return node.op === "+" ? operand : folded(node, "number", (r) => negate(f(r)), [operand]);
  }

  function arithmeticType(op: string, a: ExprType, b: ExprType, at: number): ExprType | null {
    if (a === "null" || b === "null") return "null";
    if (a === "text" || b === "text") {
      return fail(at, op === "+" ? "'+' does not join text; use || to concatenate" : `'${op}' needs numbers, found text`);
    }
    if (a === "boolean" || b === "boolean") return fail(at, `'${op}' needs numbers or dates, found a boolean`);
    const temporal = (t: ExprType): boolean => t === "date" || t === "timestamp" || t === "time";
    if (op === "*" || op === "/" || op === "%") {
      if (temporal(a) || temporal(b)) return fail(at, `'${op}' needs numbers, found ${typeName(temporal(a) ? a : b)}`);
      return "number";
    }
    if (a === "any" || b === "any") return "any";
    if (a === "number" && b === "number") return "number";
    if (op === "+") {
      if ((a === "date" || a === "timestamp") && b === "number") return a;
      if (a === "number" && (b === "date" || b === "timestamp")) return b;
      return fail(at, `cannot add ${typeName(a)} and ${typeName(b)}; add a number of days to a date`);
    }
    if ((a === "date" || a === "timestamp") && b === "number") return a;
    if ((a === "date" || a === "timestamp") && (b === "date" || b === "timestamp")) return "number";
    if (a === "time" && b === "time") return "number";
    return fail(at, `cannot subtract ${typeName(b)} from ${typeName(a)}`);
  }

  function compileArithmetic(node: NodeOf<"binary">): C | null {
    const left = compile(node.left);
    const right = left === null ? null : compile(node.right);
    if (left === null || right === null) return null;
    const type = arithmeticType(node.op, left.type, right.type, node.opStart);
    if (type === null) return null;
    const op = ARITHMETIC[node.op] as (a: Value, b: Value) => Value;
    const l = left.fn;
    const rt = right.fn;
    return folded(node, type, (r) => op(l(r), rt(r)), [left, right]);
  }

  function compileConcat(node: NodeOf<"binary">): C | null {
    const left = compile(node.left);
    const right = left === null ? null : compile(node.right);
    if (left === null || right === null) return null;
    const l = left.fn;
    const rt = right.fn;
    return folded(node, "text", (r) => {
      const a = valueToText(l(r));
      if (a === null) return null;
      const b = valueToText(rt(r));
      // Text built past the longest record a delivery may hold is NULL (unknown), not a string that
      // grows with every `||` until memory runs out.
      return b === null || a.length + b.length > MAX_RECORD_SIZE ? null : a + b;
    }, [left, right]);
  }

  function compileComparison(node: NodeOf<"binary">): C | null {
    const left = compile(node.left);
    const right = left === null ? null : compile(node.right);
    if (left === null || right === null || !checkComparable(left, right, node.opStart)) return null;
    const test = TESTS[node.op] as (c: number) => boolean;
    if (left.constant && typeof left.value === "string" && !right.constant) {
      const cmp = textLiteralComparer(left.value);
      const rt = right.fn;
      return dynamic(node, "boolean", (r) => {
        const c = cmp(rt(r));
        return c === null ? null : test(-c);
      });
    }
    return folded(node, "boolean", comparison(left.fn, against(right), test), [left, right]);
  }

  function compileLogical(node: NodeOf<"logical">): C | null {
    const left = compile(node.left);
    const right = left === null ? null : compile(node.right);
    if (left === null || right === null) return null;
    const what = `${node.op.toUpperCase()} joins conditions`;
    if (!needType(left, ["boolean"], what) || !needType(right, ["boolean"], what)) return null;
    const fn = node.op === "and" ? and(left.fn, right.fn) : or(left.fn, right.fn);
    return folded(node, "boolean", fn, [left, right]);
  }

  function compileIs(node: NodeOf<"is">): C | null {
    const operand = compile(node.operand);
    if (operand === null) return null;
    const f = operand.fn;
    const neg = node.negated;
    if (node.test === "null") return folded(node, "boolean", (r) => (f(r) === null) !== neg, [operand]);
    if (!needType(operand, ["boolean"], `IS ${node.test.toUpperCase()} tests a condition`)) return null;
    const fn: Eval =
      node.test === "true"
        ? (r) => (f(r) === true) !== neg
        : node.test === "false"
          ? (r) => (f(r) === false) !== neg
          : (r) => {
              const v = f(r);
              return (v !== true && v !== false) !== neg;
            };
    return folded(node, "boolean", fn, [operand]);
  }

  function compileDistinct(node: NodeOf<"distinct">): C | null {
    const left = compile(node.left);
    const right = left === null ? null : compile(node.right);
    if (left === null || right === null || !checkComparable(left, right, node.right.start)) return null;
    const l = left.fn;
    const vs = against(right);
    const rt = right.fn;
    const neg = node.negated;
    return folded(node, "boolean", (r) => {
      const a = l(r);
      if (a === null) return (rt(r) !== null) !== neg;
      const c = vs(a, r);
      return (c !== 0) !== neg;
    }, [left, right]);
  }

  function compileBetween(node: NodeOf<"between">): C | null {
    const parts = compileArgs([node.operand, node.low, node.high]);
    if (parts === null) return null;
    const [x, low, high] = parts as [C, C, C];
    if (!checkComparable(x, low, node.low.start) || !checkComparable(x, high, node.high.start)) return null;
    return folded(node, "boolean", between(x.fn, against(low), against(high), node.negated), parts);
  }

  function compileIn(node: NodeOf<"in">): C | null {
    const x = compile(node.operand);
    const items = x === null ? null : compileArgs(node.items);
    if (x === null || items === null) return null;
    for (const item of items) if (!checkComparable(x, item, item.node.start)) return null;
    const hasNull = items.some((i) => i.constant && i.value === null);
    // A list of literals of one kind answers a value of that kind by a set look-up.
    const literals = items.filter((i) => i.constant && i.value !== null);
    const kind = literals.length === items.length - (hasNull ? 1 : 0) ? sameKind(literals.map((i) => i.value)) : null;
    const set = kind === null ? null : new Set(literals.map((i) => i.value));
    return folded(node, "boolean", membership(x.fn, items.map(against), set, kind, hasNull, node.negated), [x, ...items]);
  }

  function compileLikeNode(node: NodeOf<"like">): C | null {
    const x = compile(node.operand);
    const pattern = x === null ? null : compile(node.pattern);
    if (x === null || pattern === null) return null;
    let escape: string | null = null;
    if (node.escape !== null) {
      const e = node.escape;
      if (e.type !== "text" || [...e.value].length !== 1) return fail(e.start, "expected one character in quotes after ESCAPE, like ESCAPE '!'");
      escape = e.value;
    }
    const f = x.fn;
    const neg = node.negated;
    if (pattern.constant) {
      if (pattern.value === null) return constant(node, "boolean", null);
      const compiled = compileLike(valueToText(pattern.value) as string, escape);
      if (!compiled.ok) return fail(pattern.node.type === "text" ? contentOffset(pattern.node, compiled.index) : pattern.node.start, compiled.message);
      const test = compiled.test;
      return folded(node, "boolean", (r) => {
        const s = valueToText(f(r));
        return s === null ? null : test(s) !== neg;
      }, [x]);
    }
    const p = pattern.fn;
    let lastPattern: string | null = null;
    let lastTest: ((s: string) => boolean) | null = null;
    return dynamic(node, "boolean", (r) => {
      const s = valueToText(f(r));
      const ps = valueToText(p(r));
      if (s === null || ps === null) return null;
      if (ps !== lastPattern) {
        const compiled = compileLike(ps, escape);
        lastPattern = ps;
        lastTest = compiled.ok ? compiled.test : null;
      }
      return lastTest === null ? null : lastTest(s) !== neg;
    });
  }

  function compileCase(node: NodeOf<"case">): C | null {
    const subject = node.subject === null ? null : compile(node.subject);
    if (node.subject !== null && subject === null) return null;
    const whens: C[] = [];
    const thens: C[] = [];
    for (const b of node.branches) {
      const w = compile(b.when);
      if (w === null) return null;
      if (subject === null ? !needType(w, ["boolean"], "WHEN needs a condition") : !checkComparable(subject, w, w.node.start)) return null;
      const t = compile(b.then);
      if (t === null) return null;
      whens.push(w);
      thens.push(t);
    }
    const otherwise = node.otherwise === null ? null : compile(node.otherwise);
    if (node.otherwise !== null && otherwise === null) return null;
    const results = otherwise === null ? thens : [...thens, otherwise];
    const type = unify(results.map((t) => t.type));
    if (type === null) {
      const first = results.find((t) => t.type !== "null" && t.type !== "any") as C;
      const clash = results.find((t) => unify([first.type, t.type]) === null) as C;
      return fail(clash.node.start, `CASE results must share one type: ${typeName(first.type)} and ${typeName(clash.type)} do not mix`);
    }
    const thenFns = thens.map((t) => t.fn);
    const elseFn = otherwise?.fn ?? null;
    const parts = [...(subject === null ? [] : [subject]), ...whens, ...results];
    const fn = subject === null ? searchedCase(whens.map((w) => w.fn), thenFns, elseFn) : simpleCase(subject.fn, whens.map(against), thenFns, elseFn);
    return folded(node, type, fn, parts);
  }

  return {
    compile,
    columns,
    aggregates,
    failure: () => failure,
  };
}

function sameKind(values: readonly Value[]): "string" | "number" | null {
  if (values.length < 2) return null;
  const k = typeof values[0];
  if (k !== "string" && k !== "number") return null;
  return values.every((v) => typeof v === k) ? k : null;
}
