import { isCollection, visit, type Document, type LineCounter, type YAMLError } from "yaml";

/** Where a YAML syntax error really is, and what to tell the person who wrote the file. */
export interface SyntaxHint {
  readonly offset: number;
  readonly message: string;
}

/**
 * The first syntax error of a YAML file, worded for its author. The library reports where parsing
 * gave up, which for the common slips is a line or more after the mistake (an unclosed quote shows at
 * the end of the file); this points at the mistake itself. Later errors mostly follow from the first,
 * so only that one is said.
 */
export function explainSyntaxError(text: string, doc: Document.Parsed, lines: LineCounter, first: YAMLError): SyntaxHint {
  const at = first.pos[0];
  const plain = { offset: at, message: firstLine(first.message) };
  switch (first.code) {
    case "RESOURCE_EXHAUSTION":
      return { offset: at, message: "the YAML nests too deeply here; a contract needs only a few levels" };
    case "TAB_AS_INDENT":
      return { offset: at, message: "a tab indents this line; YAML indents with spaces only" };
    case "MULTIPLE_DOCS":
      return { offset: at, message: "a contract is one YAML document; this starts a second one (---)" };
    case "MISSING_CHAR":
      return unclosedQuote(text, doc) ?? plain;
    case "BAD_INDENT":
      if (/^Flow (map|sequence)/.test(first.message)) return unclosedFlow(text, doc) ?? plain;
      if (first.message.startsWith("All mapping items")) return misaligned(text, lines, doc.errors, first) ?? plain;
      return plain;
    case "BLOCK_AS_IMPLICIT_KEY":
    case "MULTILINE_IMPLICIT_KEY":
      return runOn(text, lines, first) ?? plain;
    case "UNEXPECTED_TOKEN":
      return afterQuote(text, at) ?? plain;
    default:
      return plain;
  }
}

function firstLine(message: string): string {
  return message.split("\n", 1)[0]?.replace(/ at line \d+, column \d+:?$/, "") ?? message;
}

/** A quoted scalar whose closing quote never came: it runs to the end of the file. */
function unclosedQuote(text: string, doc: Document.Parsed): SyntaxHint | undefined {
  let found: SyntaxHint | undefined;
  visit(doc, {
    Scalar(_, node) {
      if (found || !node.range || (node.type !== "QUOTE_DOUBLE" && node.type !== "QUOTE_SINGLE")) return;
      const q = node.type === "QUOTE_DOUBLE" ? '"' : "'";
      const source = text.slice(node.range[0], node.range[1]).trimEnd();
      if (source.length >= 2 && source.endsWith(q)) return;
      found = { offset: node.range[0], message: `this ${q} is never closed; end the value with ${q} on the same line` };
      return visit.BREAK;
    },
  });
  return found;
}

/** A flow map `{` or sequence `[` without its closing bracket. */
function unclosedFlow(text: string, doc: Document.Parsed): SyntaxHint | undefined {
  let found: SyntaxHint | undefined;
  const check = (node: unknown): void => {
    if (found || !isCollection(node) || !node.flow || !node.range) return;
    const close = text[node.range[0]] === "{" ? "}" : "]";
    const source = text.slice(node.range[0], node.range[1]).trimEnd();
    if (!source.endsWith(close)) found = { offset: node.range[0], message: `this ${text[node.range[0]]} is never closed; end it with ${close}` };
  };
  visit(doc, {
    Map: (_, node) => (check(node), found ? visit.BREAK : undefined),
    Seq: (_, node) => (check(node), found ? visit.BREAK : undefined),
  });
  // A flow collection cut short can also leave a scalar holding the rest of the line.
  if (found === undefined) {
    visit(doc, {
      Scalar(_, node) {
        if (found || !node.range) return;
        const source = text.slice(node.range[0], node.range[1]);
        const open = source.search(/[{[]/);
        if (open >= 0 && node.type === "PLAIN") {
          found = { offset: node.range[0] + open, message: `this ${source[open]} is never closed; end it with ${source[open] === "{" ? "}" : "]"}` };
          return visit.BREAK;
        }
      },
    });
  }
  return found;
}

/** Indentation (spaces) of the line holding `offset`, and that line's start. */
function lineAt(text: string, offset: number): { start: number; indent: number } {
  const start = text.lastIndexOf("\n", offset - 1) + 1;
  let i = start;
  while (text[i] === " ") i++;
  return { start, indent: i - start };
}

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? "" : "s"}`;

/**
 * Items of one mapping that do not line up. The library flags every item after the first that differs
 * from it; when several are flagged alike, the first item is the odd one, so that is the line to fix.
 */
function misaligned(text: string, lines: LineCounter, errors: readonly YAMLError[], first: YAMLError): SyntaxHint | undefined {
  const flagged = lineAt(text, first.pos[0]);
  // The item before the flagged one: the nearest earlier line with content that is not a comment.
  let prev = flagged.start - 1;
  let before: { start: number; indent: number } | undefined;
  while (prev > 0) {
    const line = lineAt(text, prev);
    const content = text.slice(line.start + line.indent, prev).trim();
    if (content !== "" && !content.startsWith("#")) {
      before = line;
      break;
    }
    prev = line.start - 1;
  }
  if (before === undefined) return undefined;
  const alike = errors.filter((e) => e.code === "BAD_INDENT" && e.message.startsWith("All mapping items") && lineAt(text, e.pos[0]).indent === flagged.indent).length;
  const beforeLine = lines.linePos(before.start).line;
  if (alike > 1) {
    return {
      offset: before.start + before.indent,
      message: `this line is indented ${plural(before.indent, "space")} but the items after it ${plural(flagged.indent, "space")}; items of one mapping start at the same column`,
    };
  }
  return {
    offset: flagged.start + flagged.indent,
    message: `this line is indented ${plural(flagged.indent, "space")} but the item before it (line ${beforeLine}) ${plural(before.indent, "space")}; items of one mapping start at the same column`,
  };
}

/** A value that runs on into the next line: that line is indented deeper, or a key lacks its space. */
function runOn(text: string, lines: LineCounter, e: YAMLError): SyntaxHint | undefined {
  const here = lineAt(text, e.pos[0]);
  const lineText = text.slice(here.start, text.indexOf("\n", here.start) >>> 0);
  if (/^\s*[^\s:#'"]+:[^\s:]/.test(lineText) && !/^\s*[^\s:#'"]+:\s/.test(lineText)) {
    return { offset: here.start + here.indent, message: "a key needs a space after its colon (name: value)" };
  }
  const next = nextContentLine(text, here.start);
  if (next !== undefined && next.indent > here.indent) {
    const line = lines.linePos(here.start).line;
    return {
      offset: next.start + next.indent,
      message: `this line is indented deeper than line ${line} above it, so YAML reads it as part of that line's value; indent it as its neighbours are`,
    };
  }
  return undefined;
}

/** The first line after the one starting at `start` that holds something other than a comment. */
function nextContentLine(text: string, start: number): { start: number; indent: number } | undefined {
  for (let from = text.indexOf("\n", start); from >= 0; from = text.indexOf("\n", from + 1)) {
    const line = lineAt(text, from + 1);
    const content = text.slice(line.start + line.indent, (text.indexOf("\n", line.start) + 1 || text.length + 1) - 1).trim();
    if (content !== "" && !content.startsWith("#")) return line;
  }
  return undefined;
}

/** Text after a quoted value's closing quote, as in `assert: "Net Pay" <= "Gross Pay"`. */
function afterQuote(text: string, offset: number): SyntaxHint | undefined {
  const start = text.lastIndexOf("\n", offset - 1) + 1;
  const before = text.slice(start, offset).trimEnd();
  const m = /:\s+(["'])/.exec(before);
  if (!m || !before.endsWith(m[1] as string)) return undefined;
  const other = m[1] === '"' ? "'" : '"';
  const advice = `text after the closing ${m[1]} of a quoted value; to keep ${m[1]} inside the value, wrap the whole value in ${other}`;
  // A block value runs to the end of its line, so the whole value can be shown wrapped; inside a
  // flow map or list it cannot be told from what follows it.
  const end = text.indexOf("\n", offset);
  const value = text.slice(start + m.index + m[0].length - 1, end < 0 ? text.length : end).trim();
  const inFlow = /[{[]/.test(before.slice(0, m.index));
  return { offset, message: inFlow ? advice : `${advice} (${other}${value}${other})` };
}
