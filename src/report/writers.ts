import { codequality } from "./codequality.js";
import { githubAnnotations } from "./github-annotations.js";
import { githubSummary } from "./github-summary.js";
import { html } from "./html.js";
import { junit } from "./junit.js";
import { sarif } from "./sarif.js";
import type { Writer } from "./writer.js";

export type { Writer, WriterContext } from "./writer.js";
export { githubAnnotations, githubSummary };

/**
 * The machine-readable and page writers by --report format name. `github` gives the annotations for
 * stdout; its Markdown summary for $GITHUB_STEP_SUMMARY comes from githubSummary. json and text live
 * beside the model.
 */
export const writers: Readonly<Record<"sarif" | "junit" | "codequality" | "html" | "github", Writer>> = {
  sarif,
  junit,
  codequality,
  html,
  github: githubAnnotations,
};
