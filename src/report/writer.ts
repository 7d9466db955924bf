import type { DeliveryReport } from "./model.js";

/** What every writer needs beyond the reports themselves. */
export interface WriterContext {
  /** Repository root; report paths (input.path, contract.path) are already relative to it with '/' separators. */
  readonly root: string;
  /** Tool version, for the SARIF driver and the like. */
  readonly toolVersion: string;
  /** Files the run was asked about that no contract claims (root-relative). */
  readonly unclaimed?: readonly string[];
  /** Whether unclaimed files fail the run (`--require-contract`). */
  readonly unclaimedFails?: boolean;
  /** ANSI colour in text output (terminals only; see report/colour.ts). */
  readonly colour?: boolean;
}

/** A pure function from the reports of one run to the text of one output format. */
export type Writer = (reports: readonly DeliveryReport[], ctx: WriterContext) => string;
