/**
 * The scalar functions of the expression language. Each is a plain definition: arity, the static type
 * of its parameters, its result type, and a builder that turns compiled arguments into one closure.
 * All return NULL when a needed argument is NULL (coalesce excepted).
 */
import type { Value } from "../values.js";
import { valueToNumber, valueToText } from "./coerce.js";
import { roundHalfAway } from "./decimal.js";
import type { Eval, ExprType } from "./types.js";
import { unify } from "./typing.js";

/** A scalar function definition. */
export interface ScalarFunction {
  readonly min: number;
  readonly max: number;
  /** expected static type per parameter; the last one repeats for variadic functions */
  readonly params: readonly ("number" | "text" | "any")[];
  readonly result: (args: readonly ExprType[]) => ExprType | null;
  readonly build: (args: readonly Eval[]) => Eval;
}

const arg = (args: readonly Eval[], i: number): Eval => args[i] as Eval;

function numeric(op: (x: number) => number): ScalarFunction {
  return {
    min: 1,
    max: 1,
    params: ["number"],
    result: () => "number",
    build: (args) => {
      const a = arg(args, 0);
      return (r) => {
        const x = valueToNumber(a(r));
        return x === null ? null : op(x);
      };
    },
  };
}

function textual(op: (s: string) => Value): ScalarFunction {
  return {
    min: 1,
    max: 1,
    params: ["text"],
    result: () => "text",
    build: (args) => {
      const a = arg(args, 0);
      return (r) => {
        const s = valueToText(a(r));
        return s === null ? null : op(s);
      };
    },
  };
}

/** Number of characters (code points), so that an emoji counts once. */
function characterCount(s: string): number {
  let n = s.length;
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    if (c >= 0xdc00 && c <= 0xdfff && i > 0) {
      const p = s.charCodeAt(i - 1);
      if (p >= 0xd800 && p <= 0xdbff) n--;
    }
  }
  return n;
}

const SURROGATE = /[\ud800-\udfff]/;

/** SQL SUBSTRING(s FROM start FOR length): 1-based characters; a start before 1 still counts toward length. */
function substring(s: string, start: number, length: number | undefined): string | null {
  if (length !== undefined && length < 0) return null;
  const wide = SURROGATE.test(s);
  const size = wide ? characterCount(s) : s.length;
  const from = Math.max(start, 1);
  const to = length === undefined ? size + 1 : Math.min(start + length, size + 1);
  if (to <= from) return "";
  if (!wide) return s.slice(from - 1, to - 1);
  return Array.from(s).slice(from - 1, to - 1).join("");
}

/** The scalar functions by lower-case name. */
export const FUNCTIONS: Readonly<Record<string, ScalarFunction>> = {
  abs: numeric(Math.abs),
  floor: numeric(Math.floor),
  ceil: numeric(Math.ceil),
  round: {
    min: 1,
    max: 2,
    params: ["number", "number"],
    result: () => "number",
    build: (args) => {
      const a = arg(args, 0);
      const d = args[1];
      if (d === undefined) {
        return (r) => {
          const x = valueToNumber(a(r));
          return x === null ? null : roundHalfAway(x, 0);
        };
      }
      return (r) => {
        const x = valueToNumber(a(r));
        const n = valueToNumber(d(r));
        return x === null || n === null ? null : roundHalfAway(x, n);
      };
    },
  },
  lower: textual((s) => s.toLowerCase()),
  upper: textual((s) => s.toUpperCase()),
  trim: textual((s) => s.trim()),
  length: { ...textual(characterCount), result: () => "number" },
  coalesce: {
    min: 1,
    max: Infinity,
    params: ["any"],
    result: (types) => unify(types),
    build: (args) => (r) => {
      for (let i = 0; i < args.length; i++) {
        const v = (args[i] as Eval)(r);
        if (v !== null) return v;
      }
      return null;
    },
  },
  substr: {
    min: 2,
    max: 3,
    params: ["text", "number", "number"],
    result: () => "text",
    build: (args) => {
      const s = arg(args, 0);
      const start = arg(args, 1);
      const len = args[2];
      return (r) => {
        const text = valueToText(s(r));
        const from = valueToNumber(start(r));
        if (text === null || from === null) return null;
        if (len === undefined) return substring(text, Math.round(from), undefined);
        const n = valueToNumber(len(r));
        return n === null ? null : substring(text, Math.round(from), Math.round(n));
      };
    },
  },
};

/** Names that are functions but are compiled specially (aggregates, registry lookups, regex). */
export const SPECIAL_FUNCTIONS: readonly string[] = ["lookup", "matches"];
/** Aggregate functions of group asserts. */
export const AGGREGATES: readonly string[] = ["sum", "count", "min", "max", "first"];
