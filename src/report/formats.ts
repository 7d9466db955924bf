import { codequality } from "./codequality.js";
import { githubAnnotations } from "./github-annotations.js";
import { html } from "./html.js";
import { json } from "./json.js";
import { junit } from "./junit.js";
import { sarif } from "./sarif.js";
import { text } from "./text.js";
import type { Writer } from "./writer.js";

/**
 * Every report format `--report` accepts, by name. `github` writes workflow annotations; the CLI
 * also appends the Markdown summary to the file GitHub names in GITHUB_STEP_SUMMARY.
 */
export const WRITERS = { text, json, sarif, junit, github: githubAnnotations, codequality, html } satisfies Record<string, Writer>;

export type ReportFormat = keyof typeof WRITERS;
