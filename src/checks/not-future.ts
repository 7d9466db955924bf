import type { Value } from "../values.js";
import { miss, type CheckDefinition } from "./definition.js";

const MS_PER_DAY = 86_400_000;

/** `not_future`: a date or timestamp no later than today (UTC, fixed at the start of the run). */
export const notFuture: CheckDefinition = {
  name: "not_future",
  key: "not_future",
  types: ["date", "timestamp"],
  compile(spec, ctx) {
    if (spec.not_future !== true) return undefined;
    const m = miss("not after today", "is in the future");
    const endOfToday = (ctx.today + 1) * MS_PER_DAY;
    const future = (v: Value): boolean =>
      v !== null && typeof v === "object" && (v.kind === "date" ? v.days > ctx.today : v.kind === "timestamp" && v.ms >= endOfToday);
    return { description: `${ctx.column} is not in the future`, test: (v) => (future(v) ? m : undefined) };
  },
};
