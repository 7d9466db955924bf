/** Splits an expression into tokens with their offsets; never throws. */

/** What kind of lexeme a token is. */
export type TokenKind = "number" | "text" | "ident" | "quoted" | "keyword" | "op" | "end";

/** One token; `value` is the decoded text (string contents, identifier, upper-cased keyword, operator). */
export interface Token {
  readonly kind: TokenKind;
  readonly value: string;
  readonly start: number;
  readonly end: number;
}

/** A lexing or parsing failure at a character offset of the source. */
export interface SyntaxFailure {
  readonly ok: false;
  readonly offset: number;
  readonly message: string;
}

/** Reserved words (case-insensitive); a column with one of these names must be double-quoted. */
export const KEYWORDS: ReadonlySet<string> = new Set([
  "AND", "OR", "NOT", "IN", "IS", "NULL", "TRUE", "FALSE", "UNKNOWN", "BETWEEN", "LIKE", "ESCAPE",
  "CASE", "WHEN", "THEN", "ELSE", "END", "DATE", "TIME", "TIMESTAMP", "DISTINCT", "FROM",
]);

const OPERATORS = ["<>", "<=", ">=", "!=", "||", "=", "<", ">", "+", "-", "*", "/", "%", "(", ")", ","];

const MISTAKES: Readonly<Record<string, string>> = {
  "==": "'==' is not an operator; write = for equality",
  "&&": "'&&' is not an operator; write AND",
  "!": "'!' is not an operator; write NOT, or <> for inequality",
  ";": "';' is not allowed; an expression is a single condition",
  "[": "'[' is not allowed; double-quote a column name with spaces: \"Unit Price\"",
  "`": "'`' is not allowed; double-quote a column name with spaces: \"Unit Price\"",
};

const isIdentStart = (c: string): boolean => /[\p{L}_]/u.test(c);
const isIdentPart = (c: string): boolean => /[\p{L}\p{N}_$]/u.test(c);

/** Tokens of `source`, ending with an `end` token, or the first lexical error. */
export function tokenize(source: string): { ok: true; tokens: Token[] } | SyntaxFailure {
  const tokens: Token[] = [];
  let i = 0;
  const n = source.length;
  while (i < n) {
    const c = source[i] as string;
    if (/\s/u.test(c)) {
      i++;
      continue;
    }
    const start = i;
    if (c === "'" || c === '"') {
      let value = "";
      i++;
      for (;;) {
        if (i >= n) {
          const what = c === "'" ? "string" : "quoted name";
          return { ok: false, offset: start, message: `unterminated ${what}: expected a closing ${c} before the end of the expression` };
        }
        const d = source[i] as string;
        if (d === c) {
          if (source[i + 1] === c) {
            value += c;
            i += 2;
            continue;
          }
          i++;
          break;
        }
        value += d;
        i++;
      }
      if (c === '"' && value === "") return { ok: false, offset: start, message: 'empty quoted name ""; expected a column name between the quotes' };
      tokens.push({ kind: c === "'" ? "text" : "quoted", value, start, end: i });
      continue;
    }
    if (/[0-9]/.test(c) || (c === "." && /[0-9]/.test(source[i + 1] ?? ""))) {
      const m = /^(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?/.exec(source.slice(i));
      const text = (m as RegExpExecArray)[0];
      i += text.length;
      const next = source[i];
      if (next !== undefined && (isIdentPart(next) || next === ".")) {
        return { ok: false, offset: i, message: `unexpected ${JSON.stringify(next)} after the number ${text}; expected an operator or a space` };
      }
      tokens.push({ kind: "number", value: text, start, end: i });
      continue;
    }
    if (isIdentStart(c)) {
      while (i < n && isIdentPart(source[i] as string)) i++;
      const word = source.slice(start, i);
      const upper = word.toUpperCase();
      tokens.push(KEYWORDS.has(upper) ? { kind: "keyword", value: upper, start, end: i } : { kind: "ident", value: word, start, end: i });
      continue;
    }
    const two = source.slice(i, i + 2);
    const mistake = MISTAKES[two] ?? (two === "!=" ? undefined : MISTAKES[c]);
    if (mistake !== undefined) return { ok: false, offset: start, message: mistake };
    const op = OPERATORS.find((o) => source.startsWith(o, i));
    if (op === undefined) {
      return { ok: false, offset: start, message: `unexpected character ${JSON.stringify(c)}; expected a value, a column name or an operator` };
    }
    i += op.length;
    tokens.push({ kind: "op", value: op === "!=" ? "<>" : op, start, end: i });
  }
  tokens.push({ kind: "end", value: "", start: n, end: n });
  return { ok: true, tokens };
}

/** How a token reads in a message: `')'`, `keyword END`, `end of expression`... */
export function describe(t: Token): string {
  switch (t.kind) {
    case "end":
      return "end of expression";
    case "number":
      return `number ${t.value}`;
    case "text":
      return `text '${t.value.length > 20 ? t.value.slice(0, 20) + "…" : t.value}'`;
    case "ident":
      return `name ${t.value}`;
    case "quoted":
      return `name "${t.value}"`;
    case "keyword":
      return `keyword ${t.value}`;
    case "op":
      return `'${t.value}'`;
  }
}
