import type { ColumnLayout, PrepareSpec, PreparedRows } from "../engine/prepare.js";
import type { Problem } from "../problem.js";
import type { DeliverySummary, InputOptions, StructureBreak } from "./types.js";

/**
 * What the parse thread is given: the file and how to read it, and how to prepare its rows. Without
 * `columns` (the file has a header), the thread sends the header record alone and waits to be told them.
 */
export interface ParseJob {
  readonly path: string;
  readonly options: InputOptions;
  readonly prepare?: PrepareSpec;
  readonly columns?: ColumnLayout;
}

/** What the main thread says: a batch was checked (its buffers come back), or where the declared columns are. */
export type MainMessage = { readonly kind: "taken"; readonly buffers: readonly ArrayBuffer[] } | { readonly kind: "columns"; readonly columns: ColumnLayout };

/** What the parse thread says, in this order: opened (or failed), batches, end. */
export type ParseMessage =
  | { readonly kind: "opened" }
  | { readonly kind: "failed"; readonly problems: readonly Problem[] }
  | { readonly kind: "batch"; readonly text: string; readonly layout: Uint32Array; readonly prepared?: PreparedRows; readonly bytesRead: number }
  | { readonly kind: "end"; readonly structureBreak: StructureBreak | undefined; readonly summary: DeliverySummary };

/** Batches the parse thread may run ahead of the checks; bounds the memory between the two threads. */
export const BATCHES_AHEAD = 8;
