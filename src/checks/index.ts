import { max, min } from "./bounds.js";
import { codes } from "./codes.js";
import type { CheckDefinition } from "./definition.js";
import { format } from "./format.js";
import { maxLength, minLength } from "./length.js";
import { notFuture } from "./not-future.js";
import { pattern } from "./pattern.js";
import { postal } from "./postal.js";
import { scale } from "./scale.js";

export type { CellTest, CheckContext, CheckDefinition, CompiledCheck, Miss, RowView } from "./definition.js";

function byName(defs: readonly CheckDefinition[]): Readonly<Record<string, CheckDefinition>> {
  const out: Record<string, CheckDefinition> = {};
  for (const d of defs) {
    if (out[d.name]) throw new Error(`two column checks are named ${d.name}`);
    out[d.name] = d;
  }
  return out;
}

/** Every column check, by name; the name is the rule id suffix (`<column>.<name>`). Order is report order. */
export const CHECKS = byName([min, max, minLength, maxLength, pattern, format, scale, notFuture, codes, postal]);
