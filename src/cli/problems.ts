import { formatProblem, type Problem } from "../problem.js";
import { EXIT, type Io } from "./io.js";

/** Print each problem on its own line and return the "could not be judged" status. */
export function unusable(io: Io, problems: readonly Problem[]): number {
  for (const p of problems) io.stderr(`tablegate: ${formatProblem(p)}\n`);
  return EXIT.unusable;
}

/**
 * One argument problem on one line (Node's own argument messages span several; they are joined),
 * optionally followed by a `usage:` line.
 */
export function badArgument(io: Io, message: string): number {
  const [problem = "", usage] = message.split("\nusage: ");
  io.stderr(`tablegate: ${plainer(problem.replace(/\s*\n\s*/g, " "))}\n${usage === undefined ? "" : `usage: ${usage}\n`}`);
  return EXIT.unusable;
}

/** Node's argument parser, said shorter: a value that looks like an option, an option it does not know. */
function plainer(message: string): string {
  const ambiguous = /^Option '(--[\w-]+)' argument is ambiguous/.exec(message);
  if (ambiguous) return `option ${ambiguous[1]} needs a value; what follows it looks like an option (write ${ambiguous[1]}=<value> to pass it anyway)`;
  const unknown = /^Unknown option '([^']+)'/.exec(message);
  if (unknown) return `unknown option ${unknown[1]}`;
  return message;
}
