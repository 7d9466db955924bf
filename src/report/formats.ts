import { json } from "./json.js";
import { text } from "./text.js";
import type { Writer } from "./writer.js";

/** Every report format `--report` accepts, by name. */
export const WRITERS = { text, json } satisfies Record<string, Writer>;

export type ReportFormat = keyof typeof WRITERS;
