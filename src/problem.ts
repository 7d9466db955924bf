/**
 * Something wrong with what the user gave us (a contract, a registry, an argument, a file) that stops
 * a run before it can be judged. Positions are 1-based; `line` and `column` are absent when unknown.
 */
export interface Problem {
  readonly file: string;
  readonly line?: number;
  readonly column?: number;
  readonly message: string;
}

/** `file:line:col: message`, the one-line form every command prints on stderr. */
export function formatProblem(p: Problem): string {
  const where = p.line === undefined ? p.file : p.column === undefined ? `${p.file}:${p.line}` : `${p.file}:${p.line}:${p.column}`;
  return `${where}: ${p.message}`;
}

/** Either a value or the problems that prevented it. */
export type Result<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly problems: readonly Problem[] };

export const ok = <T>(value: T): Result<T> => ({ ok: true, value });
export const fail = <T>(...problems: Problem[]): Result<T> => ({ ok: false, problems });
