import type { SpecError } from "../contract/spec-error.js";
import type { Value } from "../values.js";

/** A compiled cell parser for one column: built once, called for every non-blank trimmed cell. */
export interface TypeParser {
  /** Parse trimmed, non-blank text; undefined when it is not a value of this type. */
  readonly parse: (text: string) => Value | undefined;
  /** What a valid value looks like, for reports, e.g. 'an integer' or 'a date as %Y-%m-%d'. */
  readonly expected: string;
}

/** The outcome of compiling a column type: a parser, or errors located below the column node. */
export type CompiledType = { readonly ok: true; readonly parser: TypeParser } | { readonly ok: false; readonly errors: SpecError[] };
