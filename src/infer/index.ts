import { ok, type Result } from "../problem.js";
import { decideDraft, type Draft } from "./decide.js";
import { observeDelivery, type ObserveOptions } from "./observe.js";
import { renderDraft, type RenderOptions } from "./render.js";

export type { Draft, DraftColumn } from "./decide.js";
export { formatFromName, nameFromFile } from "./suffix.js";

/** How to infer: how to read the file, and what the draft's head says. */
export interface InferOptions extends ObserveOptions, RenderOptions {}

/** A draft contract for a delivery: the decisions and the YAML text that writes them. */
export interface Inferred {
  readonly draft: Draft;
  readonly text: string;
}

/** Read a delivery once and write a draft contract that this delivery meets. */
export async function inferContract(path: string, options: InferOptions): Promise<Result<Inferred>> {
  const observed = await observeDelivery(path, options);
  if (!observed.ok) return observed;
  const draft = decideDraft(observed.value);
  return ok({ draft, text: renderDraft(draft, options) });
}
