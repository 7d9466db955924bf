import type { RowView } from "../checks/index.js";
import type { Plan } from "../contract/plan.js";
import type { HeaderMatch } from "../engine/header.js";
import type { Value } from "../values.js";
import { trimmed } from "../engine/trim.js";
import { compileColumnRepair, type ColumnRepairer, type RepairName } from "./cell-repair.js";

/** One changed cell of a record: the declared column, its position in the record, and what changed. */
export interface CellChange {
  readonly column: number;
  readonly before: string;
  readonly after: string;
  readonly repairs: readonly RepairName[];
}

/** Repairs whole records of one delivery, whose header has been matched. */
export interface RowRepairer {
  /**
   * The record's cells after repair (the same array when nothing changed). Changed cells are pushed
   * onto `changes` when given, in declared column order. A record of the wrong width is left as is:
   * its cells cannot be told apart, and the engine rejects it.
   */
  repair(cells: readonly string[], changes?: CellChange[]): readonly string[];
}

/** Compile the repairs of every declared column once, for records laid out as `header` says. */
export function createRowRepairer(plan: Plan, header: HeaderMatch): RowRepairer {
  const cols = plan.columns;
  const n = cols.length;
  const blank = plan.input.blank;
  const repairers: ColumnRepairer[] = cols.map((c) => compileColumnRepair(c, blank));
  // The row as the checks see it (trimmed texts, parsed values), built only when a check needs it.
  const values: Value[] = new Array<Value>(n).fill(null);
  const texts: string[] = new Array<string>(n).fill("");
  const view: RowView = { values, texts };
  let source: readonly string[] = [];
  let built = false;
  const row = (): RowView => {
    if (built) return view;
    built = true;
    for (let i = 0; i < n; i++) {
      const pos = header.positions[i] ?? -1;
      const text = pos < 0 ? "" : trimmed(source[pos] ?? "");
      const isBlank = text === "" || blank.has(text);
      texts[i] = isBlank ? "" : text;
      values[i] = isBlank ? null : ((cols[i]?.parse(text) ?? null) as Value);
    }
    return view;
  };
  return {
    repair(cells, changes) {
      if (cells.length !== header.width) return cells;
      source = cells;
      built = false;
      let out: string[] | undefined;
      for (let i = 0; i < n; i++) {
        const pos = header.positions[i] ?? -1;
        if (pos < 0) continue;
        const before = cells[pos] ?? "";
        const r = (repairers[i] as ColumnRepairer).repair(before, row);
        if (r === undefined || r.after === before) continue;
        out ??= cells.slice();
        out[pos] = r.after;
        changes?.push({ column: i, before, after: r.after, repairs: r.repairs });
      }
      return out ?? cells;
    },
  };
}
