import { setFlagsFromString } from "node:v8";

// Contracts may come from untrusted pull requests, so a pattern must never take exponential time.
// V8 ships a linear-time regular expression engine; with these flags a pattern that backtracks too
// much is re-run on it, and the `l` flag tells us at compile time whether a pattern can run there.
setFlagsFromString("--enable-experimental-regexp-engine");
setFlagsFromString("--enable-experimental-regexp-engine-on-excessive-backtracks");

/**
 * Compile a regular expression from a contract so that it runs in time linear in the input.
 * Refused: backreferences and lookarounds (no linear-time form) and `\p{…}` (needs the `u` flag,
 * which the linear engine lacks). Returns the RegExp, or a message and the offset it concerns.
 */
export function compileSafeRegex(source: string): RegExp | { offset: number; message: string } {
  let re: RegExp;
  try {
    re = new RegExp(source);
  } catch (e) {
    return { offset: 0, message: `not a valid regular expression: ${(e as Error).message.replace(/^Invalid regular expression: \/.*\/\w*: /s, "")}` };
  }
  const property = /\\[pP]\{/.exec(source);
  if (property) return { offset: property.index, message: "Unicode property escapes (\\p{...}) are not supported; use a character class" };
  try {
    new RegExp(source, "l");
  } catch {
    return { offset: 0, message: "backreferences and lookarounds are not allowed: they cannot run in bounded time" };
  }
  return re;
}
