/** SQL truth values of an evaluated assert or when (ISO/IEC 9075 three-valued logic). */
import type { Value } from "../values.js";

/** True only when the value is TRUE: an unknown (NULL) or FALSE condition is not true, so a `when` skips. */
export function isTrue(v: Value): boolean {
  return v === true;
}

/** True only when the value is FALSE: an assert fails only then; unknown passes, as in a CHECK constraint. */
export function isFalse(v: Value): boolean {
  return v === false;
}
