import { compileSafeRegex } from "../safe-regex.js";

/** Character classes of a word, as bits. */
const UPPER = 1;
const LOWER = 2;
const DIGIT = 4;

const CLASS_TEXT: Readonly<Record<number, string>> = {
  [UPPER]: "A-Z",
  [LOWER]: "a-z",
  [DIGIT]: "0-9",
  [UPPER | LOWER]: "A-Za-z",
  [UPPER | DIGIT]: "A-Z0-9",
  [LOWER | DIGIT]: "a-z0-9",
  [UPPER | LOWER | DIGIT]: "A-Za-z0-9",
};

// Separators a shape may contain; anything else (quotes, backslashes, letters outside ASCII) ends it.
const SEPARATORS = " -_/.:#+,@&()'";
const REGEX_SYNTAX = /[\\^$.*+?()[\]{}|/]/g;

interface Word {
  classes: number;
  min: number;
  max: number;
  /** The word's text while every value has the same one here. */
  constant: string | undefined;
}
type Token = { readonly sep: string } | { readonly word: Word };

/**
 * Tracks whether every text of a column has one shape: the same separators in the same places, with
 * runs of ASCII letters and digits between them. Memory is one token list whatever the row count.
 */
export interface ShapeTracker {
  add(text: string): void;
  /**
   * An anchored pattern every added text matches: classes with length ranges (`[A-Z]{2,5}`), words
   * that never varied written out unless `constants` is false. Undefined when the texts had no common
   * shape, or the shape says little (one run of letters, or no digits and no fixed word).
   */
  pattern(constants: boolean): string | undefined;
}

/** A fresh tracker. */
export function createShapeTracker(): ShapeTracker {
  let tokens: Token[] | undefined;
  let dead = false;

  const tokenize = (text: string): Token[] | undefined => {
    const out: Token[] = [];
    let i = 0;
    while (i < text.length) {
      const start = i;
      const run = wordRun(text, i);
      i = run.end;
      const classes = run.classes;
      if (i > start) {
        const w = text.slice(start, i);
        out.push({ word: { classes, min: w.length, max: w.length, constant: w } });
        continue;
      }
      for (; i < text.length && !isWordChar(text.charCodeAt(i)); i++) if (!SEPARATORS.includes(text[i] as string)) return undefined;
      out.push({ sep: text.slice(start, i) });
    }
    return out;
  };

  return {
    add(text) {
      if (dead) return;
      if (tokens === undefined) {
        tokens = tokenize(text);
        if (tokens === undefined) dead = true;
        return;
      }
      if (!merge(tokens, text)) dead = true;
    },
    pattern(constants) {
      if (dead || tokens === undefined) return undefined;
      const words = tokens.flatMap((t) => ("word" in t ? [t.word] : []));
      const fixed = constants && words.some((w) => w.constant !== undefined);
      if (words.length === 0 || (!fixed && !words.some((w) => (w.classes & DIGIT) !== 0))) return undefined;
      let source = "^";
      for (const t of tokens) {
        if ("sep" in t) source += t.sep.replace(REGEX_SYNTAX, "\\$&");
        else if (constants && t.word.constant !== undefined) source += t.word.constant;
        else source += `[${CLASS_TEXT[t.word.classes]}]${t.word.min === t.word.max ? (t.word.min === 1 ? "" : `{${t.word.min}}`) : `{${t.word.min},${t.word.max}}`}`;
      }
      // A draft must compile: a shape the pattern screen would refuse (long varying runs side by side) is left out.
      const full = `${source}$`;
      return compileSafeRegex(full) instanceof RegExp ? full : undefined;
    },
  };
}

/** Widen `tokens` to cover `text` in place, without building its tokens; false when the shapes differ. */
function merge(tokens: readonly Token[], text: string): boolean {
  let i = 0;
  for (let t = 0; t < tokens.length; t++) {
    const token = tokens[t] as Token;
    if ("sep" in token) {
      // a separator run is maximal: the same characters, then a word character or the end
      if (!text.startsWith(token.sep, i)) return false;
      i += token.sep.length;
      if (i < text.length && !isWordChar(text.charCodeAt(i))) return false;
      continue;
    }
    const start = i;
    const run = wordRun(text, i);
    i = run.end;
    const classes = run.classes;
    const len = i - start;
    if (len === 0) return false;
    const w = token.word;
    w.classes |= classes;
    if (len < w.min) w.min = len;
    if (len > w.max) w.max = len;
    if (w.constant !== undefined && (len !== w.constant.length || !text.startsWith(w.constant, start))) w.constant = undefined;
  }
  return i === text.length;
}

/** The run of ASCII letters and digits starting at `from`: where it ends and which classes it used. */
function wordRun(text: string, from: number): { end: number; classes: number } {
  let classes = 0;
  let i = from;
  for (; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c >= 65 && c <= 90) classes |= UPPER;
    else if (c >= 97 && c <= 122) classes |= LOWER;
    else if (c >= 48 && c <= 57) classes |= DIGIT;
    else break;
  }
  return { end: i, classes };
}

function isWordChar(c: number): boolean {
  return (c >= 65 && c <= 90) || (c >= 97 && c <= 122) || (c >= 48 && c <= 57);
}
