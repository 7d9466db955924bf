import type { ColumnPlan } from "../contract/plan.js";
import type { RowView } from "../checks/index.js";
import { trimmed } from "../engine/trim.js";
import { formatValue } from "../types/index.js";
import type { Value } from "../values.js";
import { plainNumbers } from "./plain-number.js";
import { sameValue } from "./same-value.js";

/** The repairs `fix` makes, each mechanical and meaning-preserving. */
export type RepairName = "trim" | "blank" | "date" | "number" | "boolean";

/** Every repair name, in the order they are applied and reported. */
export const REPAIR_NAMES: readonly RepairName[] = ["trim", "blank", "date", "number", "boolean"];

/** A cell as repaired and the repairs that made it, in the order applied. */
export interface CellRepair {
  readonly after: string;
  readonly repairs: readonly RepairName[];
}

/** Rewrites one trimmed, non-blank cell that parsed; undefined keeps it as it is. */
type TypedRepair = (text: string, row: () => RowView) => string | undefined;

const REPAIR_OF_TYPE: Readonly<Record<ColumnPlan["type"], RepairName | undefined>> = {
  text: undefined,
  time: undefined,
  integer: "number",
  decimal: "number",
  boolean: "boolean",
  date: "date",
  timestamp: "date",
};

/** The rewrites a parsed value could take, most plain first. */
function candidates(type: ColumnPlan["type"], value: Value, text: string): readonly string[] {
  switch (type) {
    case "date":
    case "timestamp":
      return [formatValue(value)];
    case "boolean":
      return [value === true ? "true" : "false"];
    case "integer":
    case "decimal":
      return typeof value === "number" ? plainNumbers(text, value) : [];
    default:
      return [];
  }
}

const isDigit = (c: number): boolean => c >= 48 && c <= 57;

/** Text no rewrite would change, told without parsing: most cells of a tidy delivery. */
function alreadyPlain(type: ColumnPlan["type"], text: string): boolean {
  switch (type) {
    case "date":
      // YYYY-MM-DD is what formatValue writes for years 0000-9999.
      return text.length === 10 && text.charCodeAt(4) === 45 && text.charCodeAt(7) === 45 && isDigit(text.charCodeAt(0)) && isDigit(text.charCodeAt(9));
    case "boolean":
      return text === "true" || text === "false";
    case "integer":
    case "decimal": {
      // Only a sign and digits: no separator, mark or percent to rewrite.
      for (let i = 0; i < text.length; i++) {
        const c = text.charCodeAt(i);
        if (!isDigit(c) && !(i === 0 && (c === 43 || c === 45))) return false;
      }
      return true;
    }
    default:
      return false;
  }
}

/**
 * The typed rewrite of a column: a candidate is kept only when the column's own parser reads it as
 * the same value (so the contract still accepts it and nothing changes meaning) and no check of the
 * column that passed on the cell as written fails on the rewrite (e.g. `scale` after 12.5% -> 0.125).
 */
function typedRepair(col: ColumnPlan): TypedRepair | undefined {
  if (REPAIR_OF_TYPE[col.type] === undefined) return undefined;
  const checks = col.cellChecks;
  return (text, row) => {
    if (alreadyPlain(col.type, text)) return undefined;
    const value = col.parse(text);
    if (value === undefined || value === null) return undefined;
    for (const c of candidates(col.type, value, text)) {
      if (c === text) return undefined;
      if (!sameValue(value, col.parse(c))) continue;
      let worse = false;
      if (checks.length > 0) {
        const view = row();
        for (const cc of checks) {
          if (cc.test(value, text, view) === undefined && cc.test(value, c, view) !== undefined) {
            worse = true;
            break;
          }
        }
      }
      if (!worse) return c;
    }
    return undefined;
  };
}

/** Repairs one column's cells; `repair` returns undefined when the cell stays as given. */
export interface ColumnRepairer {
  repair(raw: string, row: () => RowView): CellRepair | undefined;
}

/**
 * Compile the repairs of one column: `trim` (unless the column allows spaces), `blank` (a blank
 * marker becomes the empty cell), and the typed rewrite of its type (`date`, `number`, `boolean`).
 */
export function compileColumnRepair(col: ColumnPlan, blank: ReadonlySet<string>): ColumnRepairer {
  const keepSpaces = col.spacesCheck < 0;
  const typed = typedRepair(col);
  const typeRepair = REPAIR_OF_TYPE[col.type];
  return {
    repair(raw, row) {
      const text = trimmed(raw);
      const padded = text !== raw;
      if (text === "") return padded && !keepSpaces ? { after: "", repairs: ["trim"] } : undefined;
      if (blank.has(text)) return { after: "", repairs: padded && !keepSpaces ? ["trim", "blank"] : ["blank"] };
      const core = typed?.(text, row);
      if (core === undefined) return padded && !keepSpaces ? { after: text, repairs: ["trim"] } : undefined;
      const repairs: RepairName[] = padded && !keepSpaces ? ["trim"] : [];
      repairs.push(typeRepair as RepairName);
      if (!keepSpaces || !padded) return { after: core, repairs };
      // The column allows spaces: they stay around the rewritten value.
      const lead = raw.length - raw.trimStart().length;
      const trail = raw.length - raw.trimEnd().length;
      return { after: raw.slice(0, lead) + core + raw.slice(raw.length - trail), repairs };
    },
  };
}
