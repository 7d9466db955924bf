/**
 * Closures for the logical operators and predicates, in ISO/IEC 9075 three-valued logic: a value that
 * is not TRUE or FALSE counts as unknown. Built once per expression; they allocate nothing per row.
 */
import type { Value } from "../values.js";
import type { Eval } from "./types.js";

/** Compares a value with one operand of a predicate: -1, 0, 1, or null when unknown. */
export type Against = (a: Value, row: readonly Value[]) => number | null;

/** p AND q: FALSE if either is FALSE, TRUE if both are TRUE, otherwise unknown. */
export function and(l: Eval, r: Eval): Eval {
  return (row) => {
    const a = l(row);
    if (a === false) return false;
    const b = r(row);
    if (b === false) return false;
    return a === true && b === true ? true : null;
  };
}

/** p OR q: TRUE if either is TRUE, FALSE if both are FALSE, otherwise unknown. */
export function or(l: Eval, r: Eval): Eval {
  return (row) => {
    const a = l(row);
    if (a === true) return true;
    const b = r(row);
    if (b === true) return true;
    return a === false && b === false ? false : null;
  };
}

/** NOT p: unknown stays unknown. */
export function not(f: Eval): Eval {
  return (row) => {
    const v = f(row);
    return v === true ? false : v === false ? true : null;
  };
}

/** x <op> y through a comparer; NULL on either side is unknown. */
export function comparison(l: Eval, vs: Against, test: (c: number) => boolean): Eval {
  return (row) => {
    const a = l(row);
    if (a === null) return null;
    const c = vs(a, row);
    return c === null ? null : test(c);
  };
}

/** x [NOT] BETWEEN lo AND hi, which is x >= lo AND x <= hi. */
export function between(f: Eval, lo: Against, hi: Against, negated: boolean): Eval {
  return (row) => {
    const a = f(row);
    if (a === null) return null;
    const c1 = lo(a, row);
    const c2 = hi(a, row);
    if ((c1 !== null && c1 < 0) || (c2 !== null && c2 > 0)) return negated;
    if (c1 === null || c2 === null) return null;
    return !negated;
  };
}

/**
 * x [NOT] IN (items): TRUE on a match; without one, unknown if any comparison was unknown (a NULL
 * item), else FALSE. `set` holds the items when all are literals of one kind (`kind`), for a look-up.
 */
export function membership(
  f: Eval,
  comparers: readonly Against[],
  set: ReadonlySet<Value> | null,
  kind: "string" | "number" | null,
  hasNullItem: boolean,
  negated: boolean,
): Eval {
  const miss = hasNullItem ? null : negated;
  return (row) => {
    const a = f(row);
    if (a === null) return null;
    if (set !== null && typeof a === kind) return set.has(a) ? !negated : miss;
    let unknown = false;
    for (let i = 0; i < comparers.length; i++) {
      const c = (comparers[i] as Against)(a, row);
      if (c === 0) return !negated;
      if (c === null) unknown = true;
    }
    return unknown ? null : negated;
  };
}

/** CASE WHEN c THEN v ... ELSE e END: the first TRUE condition wins; unknown goes on to the next. */
export function searchedCase(whens: readonly Eval[], thens: readonly Eval[], otherwise: Eval | null): Eval {
  return (row) => {
    for (let i = 0; i < whens.length; i++) if ((whens[i] as Eval)(row) === true) return (thens[i] as Eval)(row);
    return otherwise === null ? null : otherwise(row);
  };
}

/** CASE x WHEN v THEN r ... END: x = v for each WHEN; a NULL subject equals nothing and falls to ELSE. */
export function simpleCase(subject: Eval, whens: readonly Against[], thens: readonly Eval[], otherwise: Eval | null): Eval {
  return (row) => {
    const a = subject(row);
    if (a !== null) for (let i = 0; i < whens.length; i++) if ((whens[i] as Against)(a, row) === 0) return (thens[i] as Eval)(row);
    return otherwise === null ? null : otherwise(row);
  };
}
