import { createRowHasher } from "../engine/row-hash.js";
import { createSeenSet } from "../engine/seen-set.js";
import { KEY_ROW_CAP } from "./key-tracker.js";

/** Counts whole-row repeats the way `duplicates:` finds them (raw cells hashed), up to KEY_ROW_CAP rows. */
export interface RowRepeats {
  observe(cells: readonly string[]): void;
  /** Rows that repeat an earlier row exactly. */
  readonly repeats: number;
  /** Rows past the cap were not compared. */
  readonly capped: boolean;
}

/** A fresh counter. */
export function createRowRepeats(): RowRepeats {
  const hasher = createRowHasher();
  const seen = createSeenSet();
  let rows = 0;
  let repeats = 0;
  return {
    observe(cells) {
      if (++rows > KEY_ROW_CAP) return;
      hasher.reset();
      for (let c = 0; c < cells.length; c++) hasher.add(cells[c] as string);
      if (seen.firstOrAdd(hasher.hi, hasher.lo, rows) !== 0) repeats++;
    },
    get repeats() {
      return repeats;
    },
    get capped() {
      return rows > KEY_ROW_CAP;
    },
  };
}
