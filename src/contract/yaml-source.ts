import { isMap, isPair, isScalar, isSeq, LineCounter, parseDocument, visit, type Alias, type Document, type Node } from "yaml";
import type { Problem, Result } from "../problem.js";
import { explainSyntaxError } from "./yaml-syntax.js";

/** A parsed YAML file that can turn paths and offsets into 1-based line and column. */
export interface YamlSource {
  readonly file: string;
  readonly text: string;
  readonly doc: Document.Parsed;
  readonly lines: LineCounter;
  /** YAML syntax errors, already positioned. */
  readonly syntaxProblems: readonly Problem[];
}

export type YamlPath = readonly (string | number)[];

/** Parse YAML text keeping source ranges; never throws. Merge keys (`<<: *anchor`) are allowed. */
export function parseYamlSource(file: string, text: string): YamlSource {
  const lines = new LineCounter();
  const doc = parseDocument(text, { lineCounter: lines, prettyErrors: false, uniqueKeys: true, merge: true });
  const first = doc.errors[0];
  const syntaxProblems: Problem[] = [];
  if (first !== undefined) {
    // The wording is a best effort over a broken document; if it trips, the library's own words stand.
    let hint: { offset: number; message: string };
    try {
      hint = explainSyntaxError(text, doc, lines, first);
    } catch {
      hint = { offset: first.pos[0], message: first.message.split("\n", 1)[0] ?? first.message };
    }
    const pos = lines.linePos(hint.offset);
    syntaxProblems.push({ file, line: pos.line, column: pos.col, message: hint.message });
  }
  return { file, text, doc, lines, syntaxProblems };
}

/** Aliases one file may expand: enough for shared column definitions, too few for a billion laughs. */
const MAX_ALIAS_COUNT = 100;

/**
 * The data of a parsed YAML file without syntax errors. An alias to an anchor never set, or more alias
 * expansions than MAX_ALIAS_COUNT, is a problem at the alias, never an exception.
 */
export function yamlData(src: YamlSource): Result<unknown> {
  try {
    // The library refuses a count equal to its limit; one more lets exactly MAX_ALIAS_COUNT through.
    return { ok: true, value: src.doc.toJS({ maxAliasCount: MAX_ALIAS_COUNT + 1 }) };
  } catch (e) {
    let alias: Alias | undefined;
    let unresolved: Alias | undefined;
    visit(src.doc, {
      Alias(_, node) {
        alias ??= node;
        if (unresolved === undefined && node.resolve(src.doc) === undefined) unresolved = node;
      },
    });
    const at = unresolved ?? alias;
    const pos = at?.range ? positionOf(src, at.range[0]) : { line: 1, column: 1 };
    const message = unresolved
      ? `*${unresolved.source} refers to no anchor &${unresolved.source} set before it`
      : `more than ${MAX_ALIAS_COUNT} alias expansions (*name); write the values out${e instanceof Error && !/alias/i.test(e.message) ? ` (${e.message})` : ""}`;
    return { ok: false, problems: [{ file: src.file, ...pos, message }] };
  }
}

/** The deepest node along `path` that exists, and whether the whole path was found. */
function nodeAt(src: YamlSource, path: YamlPath): { node: Node | null; complete: boolean } {
  let node: unknown = src.doc.contents;
  for (const key of path) {
    if (isMap(node)) {
      const pair = node.items.find((p) => isScalar(p.key) && String(p.key.value) === String(key));
      if (!pair || !pair.value) return { node: node as Node, complete: false };
      node = pair.value;
    } else if (isSeq(node) && /^\d+$/.test(String(key)) && node.items[Number(key)]) {
      node = node.items[Number(key)];
    } else {
      return { node: (node as Node | null) ?? null, complete: false };
    }
  }
  return { node: (node as Node | null) ?? null, complete: true };
}

/** The key node of `name` inside the map at `path`, for errors about the key itself. */
function keyAt(src: YamlSource, path: YamlPath, name: string): Node | null {
  const { node, complete } = nodeAt(src, path);
  if (!complete || !isMap(node)) return null;
  const pair = node.items.find((p) => isPair(p) && isScalar(p.key) && String(p.key.value) === name);
  return pair && isScalar(pair.key) ? pair.key : null;
}

function positionOf(src: YamlSource, offset: number): { line: number; column: number } {
  const pos = src.lines.linePos(offset);
  return { line: pos.line, column: pos.col };
}

/** A problem positioned at the node found at `path` (or the nearest existing parent). */
export function problemAt(src: YamlSource, path: YamlPath, message: string, options: { key?: string; offset?: number } = {}): Problem {
  const keyNode = options.key === undefined ? null : keyAt(src, path, options.key);
  const { node } = keyNode ? { node: keyNode } : nodeAt(src, path);
  if (!node?.range) return { file: src.file, line: 1, column: 1, message };
  let at = node.range[0];
  if (options.offset !== undefined && isScalar(node) && typeof node.value === "string") {
    at = sourceOffsetInScalar(src.text, node.range[0], node.range[1], node.value, options.offset);
  }
  return { file: src.file, ...positionOf(src, at), message };
}

/**
 * Map a character offset in a scalar's value to an offset in the file. The value differs from its
 * source by quotes, escapes, folding and indentation, so align the two greedily character by character;
 * in a double-quoted scalar an escape (`\t`, `\x41`, `\u00e9`, `\U0001F3D5`) stands for one
 * character of the value, and an escaped line break for none (YAML 1.2 section 5.7).
 */
function sourceOffsetInScalar(text: string, start: number, end: number, value: string, offset: number): number {
  let p = start;
  const first = text[p];
  const double = first === '"';
  if (first === "'" || double) p++;
  else if (first === "|" || first === ">") p = text.indexOf("\n", p) + 1 || p;
  for (let i = 0; i < value.length && p < end; i++) {
    if (double) p = skipEscapedBreaks(text, p, end);
    if (double && text[p] === "\\") {
      if (i === offset) return p;
      const e = text[p + 1];
      const digits = e === "x" ? 2 : e === "u" ? 4 : e === "U" ? 8 : 0;
      // Beyond the BMP the value holds the character as two UTF-16 units.
      if (digits === 8 && Number.parseInt(text.slice(p + 2, p + 10), 16) > 0xffff) i++;
      p += 2 + digits;
      continue;
    }
    const c = value[i];
    while (p < end && text[p] !== c && !(c === " " && (text[p] === "\n" || text[p] === " "))) p++;
    if (i === offset) return Math.min(p, end);
    p++;
  }
  return Math.min(p, end);
}

/** Past any backslash-newline continuations at `p` and the indentation after each. */
function skipEscapedBreaks(text: string, p: number, end: number): number {
  while (p < end && text[p] === "\\" && (text[p + 1] === "\n" || text[p + 1] === "\r")) {
    p += text[p + 1] === "\r" && text[p + 2] === "\n" ? 3 : 2;
    while (p < end && (text[p] === " " || text[p] === "\t")) p++;
  }
  return p;
}
