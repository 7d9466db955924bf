import type { Problem } from "../problem.js";
import type { DeliverySummary, InputOptions, StructureBreak } from "./types.js";

/** What the parse thread is given: the file and how to read it. */
export interface ParseJob {
  readonly path: string;
  readonly options: InputOptions;
}

/** What the parse thread says, in this order: opened (or failed), batches, end. */
export type ParseMessage =
  | { readonly kind: "opened" }
  | { readonly kind: "failed"; readonly problems: readonly Problem[] }
  | { readonly kind: "batch"; readonly text: string; readonly layout: Uint32Array; readonly bytesRead: number }
  | { readonly kind: "end"; readonly structureBreak: StructureBreak | undefined; readonly summary: DeliverySummary };

/** Batches the parse thread may run ahead of the checks; bounds the memory between the two threads. */
export const BATCHES_AHEAD = 8;
