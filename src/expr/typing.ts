/** Static types of sub-expressions, so that mistakes such as comparing a date with a number fail at compile time. */
import type { ColumnType } from "../contract/types.js";
import type { ExprType } from "./types.js";

/** The expression type of a declared column type. */
export function typeOfColumn(t: ColumnType | undefined): ExprType {
  if (t === undefined) return "any";
  return t === "integer" || t === "decimal" ? "number" : t;
}

/** The common type of values that meet in one place (CASE branches, coalesce), or null when they conflict. */
export function unify(types: readonly ExprType[]): ExprType | null {
  let out: ExprType = "null";
  for (const t of types) {
    if (t === "null" || t === out) continue;
    if (t === "any" || out === "any") out = "any";
    else if (out === "null") out = t;
    else if ((out === "date" && t === "timestamp") || (out === "timestamp" && t === "date")) out = "timestamp";
    else return null;
  }
  return out;
}

/** Whether SQL would let two values of these types be compared (text casts to the other side). */
export function comparable(a: ExprType, b: ExprType): boolean {
  if (a === b || a === "any" || b === "any" || a === "null" || b === "null" || a === "text" || b === "text") return true;
  return (a === "date" && b === "timestamp") || (a === "timestamp" && b === "date");
}

/** How a type reads in a message. */
export function typeName(t: ExprType): string {
  return t === "any" ? "a value" : t === "null" ? "NULL" : `a ${t}`;
}
