/**
 * A problem found while compiling part of a contract, located relative to the YAML node being
 * compiled: `path` are the keys/indexes below that node, `offset` a character offset inside the
 * string scalar at `path` (for expressions and regexes). The loader turns it into file:line:col.
 */
export interface SpecError {
  readonly path: readonly (string | number)[];
  readonly message: string;
  readonly offset?: number;
}
