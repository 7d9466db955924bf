import { setFlagsFromString } from "node:v8";

// Contracts may come from untrusted pull requests, so a pattern must never take exponential time.
// V8 ships a linear-time regular expression engine; with these flags a pattern that backtracks too
// much is re-run on it, and the `l` flag tells us at compile time whether a pattern can run there.
setFlagsFromString("--enable-experimental-regexp-engine");
setFlagsFromString("--enable-experimental-regexp-engine-on-excessive-backtracks");

/**
 * Compile a regular expression from a contract so that it runs in time linear in the input.
 * Refused: backreferences and lookarounds (no linear-time form), `\p{…}` (needs the `u` flag, which
 * the linear engine lacks), and counts above 16 inside a repeated group (the linear engine takes
 * counts up to 16; larger ones are accepted only where no repeat nests in another). Returns the RegExp, or a message and the offset it concerns.
 */
export function compileSafeRegex(source: string): RegExp | { offset: number; message: string } {
  let re: RegExp;
  try {
    re = new RegExp(source);
  } catch (e) {
    return { offset: 0, message: `not a valid regular expression: ${(e as Error).message.replace(/^Invalid regular expression: \/.*\/\w*: /s, "")}` };
  }
  const property = escapeAt(source, /[pP]/);
  if (property !== undefined) return { offset: property, message: "Unicode property escapes (\\p{...}) are not supported; use a character class" };
  if (linear(source)) return re;
  // The linear engine also refuses counted repeats above 16 ({1,20}); those alone are harmless unless
  // a repeated group nests another repeat, which is what makes backtracking explode.
  if (linear(source.replace(/\{(\d+)(,(\d*))?\}/g, (_m, a: string, comma?: string, b?: string) => `{${Math.min(Number(a), 16)}${comma ? `,${b === "" ? "" : Math.min(Number(b), 16)}` : ""}}`))) {
    const nested = nestedRepeat(source);
    if (nested === undefined) return re;
    return { offset: nested, message: "a repeated group must not contain another repeat when counts above 16 are used (e.g. \"(a{1,20})+\"): it can take exponential time" };
  }
  return { offset: 0, message: "this pattern cannot run in bounded time: backreferences, lookarounds and large counted repeats of repeated groups are not allowed" };
}

function linear(source: string): boolean {
  try {
    new RegExp(source, "l");
    return true;
  } catch {
    return false;
  }
}

/** Offset of a backslash that really escapes a character matching `what` (not an escaped backslash). */
function escapeAt(source: string, what: RegExp): number | undefined {
  for (let i = 0; i < source.length; i++) {
    if (source[i] !== "\\") continue;
    if (what.test(source[i + 1] ?? "") && source[i + 2] === "{") return i;
    i++;
  }
  return undefined;
}

function isRepeat(source: string, i: number): boolean {
  const c = source[i];
  return c === "*" || c === "+" || (c === "{" && /^\{\d+(,\d*)?\}/.test(source.slice(i)));
}

/** Offset of a group that repeats and holds a repeat or an alternation inside, if any. */
function nestedRepeat(source: string): number | undefined {
  const stack: { start: number; risky: boolean }[] = [];
  let inClass = false;
  for (let i = 0; i < source.length; i++) {
    const c = source[i];
    if (c === "\\") {
      i++;
      continue;
    }
    if (inClass) {
      if (c === "]") inClass = false;
      continue;
    }
    if (c === "[") inClass = true;
    else if (c === "(") stack.push({ start: i, risky: false });
    else if (c === ")") {
      const group = stack.pop();
      if (!group) continue;
      const repeated = isRepeat(source, i + 1);
      if (repeated && group.risky) return group.start;
      const parent = stack[stack.length - 1];
      if (parent && (group.risky || repeated)) parent.risky = true;
    } else if ((c === "|" || isRepeat(source, i)) && stack.length > 0) {
      const top = stack[stack.length - 1];
      if (top) top.risky = true;
    }
  }
  return undefined;
}
