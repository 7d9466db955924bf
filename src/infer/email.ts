import type { CellTest, CheckContext } from "../checks/definition.js";
import { format } from "../checks/format.js";

// The `format: email` check exactly as a contract compiles it, so a draft proposes it only when
// `check` would accept every value. It reads nothing from the context.
const context: CheckContext = {
  column: "",
  columnIndex: () => undefined,
  columnNames: [],
  sensitive: () => false,
  codeSet: () => ({ field: "table", message: "" }),
  today: 0,
  writtenNumber: () => undefined,
};
const compiled = format.compile({ type: "text", format: "email" }, context);
const test: CellTest | undefined = compiled !== undefined && !Array.isArray(compiled) ? compiled.test : undefined;
const row = { values: [], texts: [] };

/** Whether a trimmed text passes the contract check `format: email`. */
export function isEmail(text: string): boolean {
  return test !== undefined && text.includes("@") && test(text, text, row) === undefined;
}
