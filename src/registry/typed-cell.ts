import { parseIsoDate } from "../types/iso.js";
import { dateValue, type Value } from "../values.js";
import type { RefColumnType } from "./manifest.js";

/**
 * A registry cell as the value its column's declared type makes it, for expressions: a `date` column
 * gives dates (so `sold_on - lookup(...)` is a number of days), `integer` and `decimal` numbers,
 * `boolean` true or false. The table loader has already refused cells that do not fit their type.
 */
export function typedCell(type: RefColumnType | undefined, text: string): Value {
  switch (type) {
    case "date": {
      const days = parseIsoDate(text);
      return days === undefined ? text : dateValue(days);
    }
    case "integer":
    case "decimal":
      return Number(text);
    case "boolean":
      return text === "true";
    default:
      return text;
  }
}
