import type { Level } from "./model.js";

const CODES: Readonly<Record<Level | "pass" | "fail" | "dim", string>> = {
  error: "\x1b[1;31m",
  warning: "\x1b[33m",
  note: "\x1b[36m",
  pass: "\x1b[1;32m",
  fail: "\x1b[1;31m",
  dim: "\x1b[2m",
};

/** Wrap text in an ANSI colour when `on`; plain text otherwise. */
export function paint(on: boolean | undefined, kind: keyof typeof CODES, text: string): string {
  return on ? `${CODES[kind]}${text}\x1b[0m` : text;
}

/**
 * Colour only for a terminal, never with NO_COLOR set to anything non-empty (no-color.org), and
 * FORCE_COLOR to force it otherwise. NO_COLOR wins when both are set: a reader who asked for no
 * colour gets none.
 */
export function wantColour(env: Readonly<Record<string, string | undefined>>, isTty: boolean): boolean {
  if (env.NO_COLOR) return false;
  if (env.FORCE_COLOR !== undefined && env.FORCE_COLOR !== "0" && env.FORCE_COLOR !== "false") return true;
  return isTty;
}
