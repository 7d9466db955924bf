import { formatProblem, type Problem } from "../problem.js";
import { EXIT, type Io } from "./io.js";

/** Print each problem on its own line and return the "could not be judged" status. */
export function unusable(io: Io, problems: readonly Problem[]): number {
  for (const p of problems) io.stderr(`tablegate: ${formatProblem(p)}\n`);
  return EXIT.unusable;
}

/** One argument problem, worded like the others. */
export function badArgument(io: Io, message: string): number {
  io.stderr(`tablegate: ${message}\n`);
  return EXIT.unusable;
}
