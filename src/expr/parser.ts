/**
 * Recursive-descent parser for the rule expression language. Hand-written rather than a general SQL
 * parser so that every error names the exact offending character and what was expected there, and so
 * that nothing outside the subset (subqueries, casts, statements) is accepted only to be refused later.
 * Precedence, loosest first (as PostgreSQL): OR; AND; NOT; IS; comparison; BETWEEN IN LIKE; ||; + -;
 * * / %; unary sign.
 */
import type { BinaryOp, Node } from "./ast.js";
import { describe, tokenize, type SyntaxFailure, type Token } from "./lexer.js";

const COMPARISONS: ReadonlySet<string> = new Set(["=", "<>", "<", "<=", ">", ">="]);
/** Bounds that keep a hostile contract from exhausting the stack of the recursive parser and compiler. */
const MAX_LENGTH = 4000;
const MAX_DEPTH = 64;

/** The syntax tree of `source`, or the offset and message of the first syntax error. */
export function parse(source: string): { ok: true; node: Node } | SyntaxFailure {
  if (source.length > MAX_LENGTH) return { ok: false, offset: MAX_LENGTH, message: `the expression is longer than ${MAX_LENGTH} characters; split it into several rules` };
  const lexed = tokenize(source);
  if (!lexed.ok) return lexed;
  const tokens = lexed.tokens;
  let pos = 0;
  let failure: SyntaxFailure | null = null;
  let depth = 0;

  const peek = (ahead = 0): Token => (tokens[Math.min(pos + ahead, tokens.length - 1)] as Token);
  const next = (): Token => {
    const t = peek();
    if (pos < tokens.length - 1) pos++;
    return t;
  };
  const isKw = (t: Token, word: string): boolean => t.kind === "keyword" && t.value === word;
  const isOp = (t: Token, op: string): boolean => t.kind === "op" && t.value === op;
  const fail = (at: Token, message: string): null => {
    failure ??= { ok: false, offset: at.start, message };
    return null;
  };
  const expected = (what: string, at: Token = peek()): null => fail(at, `expected ${what}, found ${describe(at)}`);
  const closeParen = (open: Token): boolean => {
    if (isOp(peek(), ")")) {
      next();
      return true;
    }
    expected(`')' to close the '(' at character ${open.start + 1} of the expression`);
    return false;
  };

  function parseOr(): Node | null {
    let left = parseAnd();
    while (left !== null && isKw(peek(), "OR")) {
      next();
      const right = parseAnd();
      if (right === null) return null;
      left = { type: "logical", op: "or", left, right, start: left.start, end: right.end };
    }
    return left;
  }

  function parseAnd(): Node | null {
    let left = parseNot();
    while (left !== null && isKw(peek(), "AND")) {
      next();
      const right = parseNot();
      if (right === null) return null;
      left = { type: "logical", op: "and", left, right, start: left.start, end: right.end };
    }
    return left;
  }

  /** Run a nested parse one level deeper, refusing to go past MAX_DEPTH. */
  function nested(opener: Token, parseInner: () => Node | null): Node | null {
    if (depth >= MAX_DEPTH) return fail(opener, `the expression nests deeper than ${MAX_DEPTH} levels; simplify it`);
    depth++;
    const node = parseInner();
    depth--;
    return node;
  }

  function parseNot(): Node | null {
    if (!isKw(peek(), "NOT")) return parseIs();
    const not = next();
    const operand = nested(not, parseNot);
    return operand === null ? null : { type: "unary", op: "not", operand, start: not.start, end: operand.end };
  }

  function parseIs(): Node | null {
    let left = parseComparison();
    while (left !== null && isKw(peek(), "IS")) {
      next();
      let negated = false;
      if (isKw(peek(), "NOT")) {
        next();
        negated = true;
      }
      const t = next();
      if (isKw(t, "DISTINCT")) {
        if (!isKw(peek(), "FROM")) return expected("FROM after IS DISTINCT");
        next();
        const right = parseComparison();
        if (right === null) return null;
        left = { type: "distinct", negated, left, right, start: left.start, end: right.end };
        continue;
      }
      const test = t.kind === "keyword" ? ({ NULL: "null", TRUE: "true", FALSE: "false", UNKNOWN: "unknown" } as const)[t.value as "NULL"] : undefined;
      if (test === undefined) return expected(`NULL, TRUE, FALSE, UNKNOWN or DISTINCT FROM after IS${negated ? " NOT" : ""}`, t);
      left = { type: "is", negated, test, operand: left, start: left.start, end: t.end };
    }
    return left;
  }

  function parseComparison(): Node | null {
    const left = parsePredicate();
    if (left === null) return null;
    const t = peek();
    if (t.kind !== "op" || !COMPARISONS.has(t.value)) return left;
    next();
    const right = parsePredicate();
    if (right === null) return null;
    const again = peek();
    if (again.kind === "op" && COMPARISONS.has(again.value)) {
      return fail(again, `expected AND, OR or the end of the expression, found '${again.value}': comparisons do not chain; write a < b AND b < c`);
    }
    return { type: "binary", op: t.value as BinaryOp, opStart: t.start, left, right, start: left.start, end: right.end };
  }

  function parsePredicate(): Node | null {
    const operand = parseConcat();
    if (operand === null) return null;
    let negated = false;
    let t = peek();
    if (isKw(t, "NOT") && (isKw(peek(1), "BETWEEN") || isKw(peek(1), "IN") || isKw(peek(1), "LIKE"))) {
      next();
      negated = true;
      t = peek();
    }
    if (isKw(t, "BETWEEN")) {
      next();
      const low = parseConcat();
      if (low === null) return null;
      if (!isKw(peek(), "AND")) return expected(`AND to complete the BETWEEN at character ${t.start + 1} of the expression`);
      next();
      const high = parseConcat();
      if (high === null) return null;
      return { type: "between", negated, operand, low, high, start: operand.start, end: high.end };
    }
    if (isKw(t, "IN")) {
      next();
      const open = peek();
      if (!isOp(open, "(")) return expected("'(' to start the list after IN");
      next();
      const items: Node[] = [];
      for (;;) {
        const item = nested(open, parseOr);
        if (item === null) return null;
        items.push(item);
        if (!isOp(peek(), ",")) break;
        next();
      }
      if (!isOp(peek(), ")")) return expected(`',' or ')' to close the '(' at character ${open.start + 1} of the expression`);
      const end = next().end;
      return { type: "in", negated, operand, items, start: operand.start, end };
    }
    if (isKw(t, "LIKE")) {
      next();
      const pattern = parseConcat();
      if (pattern === null) return null;
      let escape: Node | null = null;
      if (isKw(peek(), "ESCAPE")) {
        next();
        escape = parseConcat();
        if (escape === null) return null;
      }
      return { type: "like", negated, operand, pattern, escape, start: operand.start, end: (escape ?? pattern).end };
    }
    return operand;
  }

  function binaryLevel(ops: readonly string[], below: () => Node | null): Node | null {
    let left = below();
    for (;;) {
      if (left === null) return null;
      const t = peek();
      if (t.kind !== "op" || !ops.includes(t.value)) return left;
      next();
      const right = below();
      if (right === null) return null;
      left = { type: "binary", op: t.value as BinaryOp, opStart: t.start, left, right, start: left.start, end: right.end };
    }
  }
  const parseConcat = (): Node | null => binaryLevel(["||"], parseAdditive);
  const parseAdditive = (): Node | null => binaryLevel(["+", "-"], parseMultiplicative);
  const parseMultiplicative = (): Node | null => binaryLevel(["*", "/", "%"], parseUnary);

  function parseUnary(): Node | null {
    const t = peek();
    if (isOp(t, "-") || isOp(t, "+")) {
      next();
      const operand = nested(t, parseUnary);
      return operand === null ? null : { type: "unary", op: t.value as "-" | "+", operand, start: t.start, end: operand.end };
    }
    return parsePrimary();
  }

  function parseCase(caseToken: Token): Node | null {
    let subject: Node | null = null;
    if (!isKw(peek(), "WHEN")) {
      subject = parseOr();
      if (subject === null) return null;
      if (!isKw(peek(), "WHEN")) return expected(`WHEN to continue the CASE at character ${caseToken.start + 1} of the expression`);
    }
    const branches: { when: Node; then: Node }[] = [];
    while (isKw(peek(), "WHEN")) {
      next();
      const when = parseOr();
      if (when === null) return null;
      if (!isKw(peek(), "THEN")) return expected(`THEN after the WHEN condition of the CASE at character ${caseToken.start + 1} of the expression`);
      next();
      const then = parseOr();
      if (then === null) return null;
      branches.push({ when, then });
    }
    let otherwise: Node | null = null;
    if (isKw(peek(), "ELSE")) {
      next();
      otherwise = parseOr();
      if (otherwise === null) return null;
    }
    if (!isKw(peek(), "END")) return expected(`${otherwise === null ? "WHEN, ELSE or " : ""}END to close the CASE at character ${caseToken.start + 1} of the expression`);
    const end = next().end;
    return { type: "case", subject, branches, otherwise, start: caseToken.start, end };
  }

  function parsePrimary(): Node | null {
    const t = peek();
    switch (t.kind) {
      case "number": {
        next();
        const value = Number(t.value);
        if (!Number.isFinite(value)) return fail(t, `number ${t.value} is out of range`);
        return { type: "number", value, start: t.start, end: t.end };
      }
      case "text":
        next();
        return { type: "text", value: t.value, start: t.start, end: t.end };
      case "quoted":
        next();
        if (isOp(peek(), "(")) return fail(peek(), `expected an operator after the column "${t.value}", found '('; function names are written without quotes`);
        return { type: "column", name: t.value, quoted: true, start: t.start, end: t.end };
      case "ident": {
        next();
        if (!isOp(peek(), "(")) return { type: "column", name: t.value, quoted: false, start: t.start, end: t.end };
        const open = next();
        const args: Node[] = [];
        let star = false;
        if (isOp(peek(), "*") && isOp(peek(1), ")")) {
          next();
          star = true;
        } else if (!isOp(peek(), ")")) {
          for (;;) {
            const arg = nested(open, parseOr);
            if (arg === null) return null;
            args.push(arg);
            if (!isOp(peek(), ",")) break;
            next();
          }
        }
        if (!isOp(peek(), ")")) return expected(`${args.length > 0 ? "',' or " : ""}')' to close the '(' at character ${open.start + 1} of the expression`);
        const end = next().end;
        return { type: "call", name: t.value, nameEnd: t.end, args, star, start: t.start, end };
      }
      case "op":
        if (t.value === "(") {
          next();
          const inner = nested(t, parseOr);
          if (inner === null || !closeParen(t)) return null;
          return inner;
        }
        return expected("a value, a column name or '('");
      case "keyword": {
        const word = source.slice(t.start, t.end);
        if (t.value === "TRUE" || t.value === "FALSE") {
          next();
          return { type: "boolean", value: t.value === "TRUE", start: t.start, end: t.end };
        }
        if (t.value === "NULL") {
          next();
          return { type: "null", start: t.start, end: t.end };
        }
        if (t.value === "CASE") return nested(t, () => parseCase(next()));
        if (t.value === "DATE" || t.value === "TIME" || t.value === "TIMESTAMP") {
          next();
          const lit = peek();
          if (lit.kind !== "text") {
            const example = t.value === "DATE" ? "'2026-01-31'" : t.value === "TIME" ? "'08:30:00'" : "'2026-01-31T08:30:00Z'";
            return expected(`a quoted value after ${t.value} as in ${t.value} ${example} (a column named ${word} must be double-quoted: "${word}")`, lit);
          }
          next();
          const text = { type: "text" as const, value: lit.value, start: lit.start, end: lit.end };
          return { type: "typed", kind: t.value.toLowerCase() as "date", text, start: t.start, end: lit.end };
        }
        return expected(`a value (a column named ${word} must be double-quoted: "${word}")`);
      }
      case "end":
        return expected("a value, a column name or '('");
    }
  }

  const node = parseOr();
  if (node === null) return failure ?? { ok: false, offset: 0, message: "cannot parse the expression" };
  const rest = peek();
  if (rest.kind !== "end") {
    const before = tokens[pos - 1];
    if (rest.kind === "ident" && before !== undefined && (before.kind === "ident" || before.kind === "quoted")) {
      const name = source.slice(before.start, rest.end).replace(/^"|"$/g, "");
      return { ok: false, offset: rest.start, message: `expected an operator or the end of the expression, found ${describe(rest)}; a column name with spaces must be double-quoted: "${name}"` };
    }
    if (isOp(rest, ")")) return { ok: false, offset: rest.start, message: "found ')' without a matching '('; expected an operator or the end of the expression" };
    return { ok: false, offset: rest.start, message: `expected an operator or the end of the expression, found ${describe(rest)}` };
  }
  return { ok: true, node };
}
