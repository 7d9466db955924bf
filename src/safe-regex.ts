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
  // The linear engine also refuses counted repeats above 16 ({1,20}), so such a pattern runs on the
  // backtracking engine with nothing to stop it. It is safe when its backtracking is bounded by its
  // counts: no repeat whose count can vary ({n} cannot), or exactly one, anchored at the start (one
  // starting place) and with no alternation: `^[A-Z0-9]{1,20}$`, `^.{0,255}$`, `^[A-Z]{2}[0-9]{2}[A-Z0-9]{11,30}$`.
  // Two that can vary side by side (`a{0,3000}a{0,3000}b`) backtrack as the product of their counts.
  if (linear(source.replace(/\{(\d+)(,(\d*))?\}/g, (_m, a: string, comma?: string, b?: string) => `{${Math.min(Number(a), 16)}${comma ? `,${b === "" ? "" : Math.min(Number(b), 16)}` : ""}}`))) {
    const nested = nestedRepeat(source);
    if (nested !== undefined) return { offset: nested, message: "a repeated group must not contain another repeat when counts above 16 are used (e.g. \"(a{1,20})+\"): it can take exponential time" };
    const shape = repeatShape(source);
    if (shape.varying === 0 || (source.startsWith("^") && !shape.alternation && shape.varying === 1)) return re;
    return { offset: 0, message: "a pattern with a count above 16 may have only one repeat whose count can vary, and then must start with ^ and have no |; otherwise it can take time that grows with the product of its counts (for a length limit use min_length and max_length)" };
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

/**
 * The characters of a pattern that are syntax (outside character classes, not escaped), each with the
 * syntax character right before it (undefined when an escape or a class came between).
 */
function* syntax(source: string): Generator<{ c: string; i: number; prev: string | undefined }> {
  let inClass = false;
  let prev: string | undefined;
  for (let i = 0; i < source.length; i++) {
    const c = source[i] as string;
    if (c === "\\") {
      i++;
      prev = undefined;
    } else if (inClass) {
      if (c === "]") inClass = false;
    } else if (c === "[") {
      inClass = true;
      prev = undefined;
    } else {
      yield { c, i, prev };
      prev = c;
    }
  }
}

/** Offset of a group that repeats and holds a repeat or an alternation inside, if any. */
function nestedRepeat(source: string): number | undefined {
  const stack: { start: number; risky: boolean }[] = [];
  for (const { c, i } of syntax(source)) {
    if (c === "(") stack.push({ start: i, risky: false });
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

/** How many repeats can match a varying count (`*`, `+`, `?`, `{m,n}` with m < n), and whether `|` appears. */
function repeatShape(source: string): { varying: number; alternation: boolean } {
  let varying = 0;
  let alternation = false;
  for (const { c, i, prev } of syntax(source)) {
    if (c === "|") alternation = true;
    else if (c === "*" || c === "+") varying++;
    // `?` opening a group (`(?:`, `(?=`, `(?<name>`) or right after a repeat (lazy) is no repeat of its own
    else if (c === "?" && prev !== "(" && prev !== "*" && prev !== "+" && prev !== "?" && prev !== "}") varying++;
    else if (c === "{") {
      const m = /^\{(\d+)(,(\d*))?\}/.exec(source.slice(i));
      if (m && m[2] !== undefined && (m[3] === "" || Number(m[3]) !== Number(m[1]))) varying++;
    }
  }
  return { varying, alternation };
}
