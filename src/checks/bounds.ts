import type { ColumnSpec } from "../contract/types.js";
import type { SpecError } from "../contract/spec-error.js";
import { compareValues, formatValue, parseBound } from "../types/index.js";
import type { Value } from "../values.js";
import { withArticle } from "./article.js";
import { miss, type CheckContext, type CheckDefinition, type CompiledCheck } from "./definition.js";
import { compareWritten } from "./exact-decimal.js";

const ORDERED = ["integer", "decimal", "date", "timestamp", "time"] as const;

function bound(spec: ColumnSpec, key: "min" | "max"): Value | SpecError[] {
  const written = spec[key];
  const parsed = written === undefined ? undefined : parseBound(spec, written);
  if (parsed === undefined || parsed === null) {
    const want = spec.type === "integer" || spec.type === "decimal" ? "a number" : `an ISO 8601 ${spec.type}`;
    return [{ path: [key], message: `${key} must be ${want} for ${withArticle(spec.type)} column; got ${JSON.stringify(written)}` }];
  }
  return parsed;
}

function compileBound(key: "min" | "max", spec: ColumnSpec, ctx: CheckContext): CompiledCheck | SpecError[] {
  const column = ctx.column;
  const limit = bound(spec, key);
  if (Array.isArray(limit)) return limit;
  const written = typeof limit === "number" ? (ctx.writtenNumber([key]) ?? String(limit)) : undefined;
  const shown = written ?? formatValue(limit as Value);
  // Numbers compare as doubles; a tie is settled on the digits as written (0.3000000000000000001 > 0.3).
  // Decimals of at most 15 significant digits map to distinct doubles, so short ties are real ties.
  const shortBound = written !== undefined && /^[-+]?[\d.]{1,16}$/.test(written) && written.replace(/[-+.]/g, "").length <= 15;
  const order = (v: Value, text: string): number => {
    const c = compareValues(v, limit as Value);
    return c === 0 && written !== undefined && !(shortBound && text.length <= 15) ? compareWritten(text, written, spec) : c;
  };
  if (key === "min") {
    const m = miss(`>= ${shown}`, `is below the minimum ${shown}`);
    return { description: `${column} at least ${shown}`, test: (v, text) => (order(v, text) < 0 ? m : undefined) };
  }
  const m = miss(`<= ${shown}`, `is above the maximum ${shown}`);
  return { description: `${column} at most ${shown}`, test: (v, text) => (order(v, text) > 0 ? m : undefined) };
}

/** `min`: the smallest allowed value, inclusive. */
export const min: CheckDefinition = { name: "min", key: "min", types: ORDERED, compile: (spec, ctx) => compileBound("min", spec, ctx) };

/** `max`: the largest allowed value, inclusive. */
export const max: CheckDefinition = { name: "max", key: "max", types: ORDERED, compile: (spec, ctx) => compileBound("max", spec, ctx) };
