import { parseArgs, type ParseArgsConfig } from "node:util";
import { formatProblem, type Problem } from "../problem.js";
import { EXIT, type Io } from "./io.js";

/** Print each problem on its own line and return the "could not be judged" status. */
export function unusable(io: Io, problems: readonly Problem[]): number {
  for (const p of problems) io.stderr(`tablegate: ${formatProblem(p)}\n`);
  return EXIT.unusable;
}

/**
 * One argument problem on one line (Node's own argument messages span several; they are joined),
 * ending with where the usage is: `tablegate <command> --help`.
 */
export function badArgument(io: Pick<Io, "stderr">, command: string, message: string): number {
  io.stderr(`tablegate: ${plainer(message.replace(/\s*\n\s*/g, " "))}; run ${helpCommand(command)} for usage\n`);
  return EXIT.unusable;
}

/** The command line that prints the usage of `command` ("" for the tool as a whole). */
export function helpCommand(command: string): string {
  return command === "" ? "tablegate --help" : `tablegate ${command} --help`;
}

/** Print a command's usage on stdout, as asked for with --help. */
export function showUsage(io: Pick<Io, "stdout">, usage: string): number {
  io.stdout(`usage: ${usage}\n`);
  return EXIT.pass;
}

/** Node's argument parser, said shorter: a value that looks like an option, an option it does not know. */
function plainer(message: string): string {
  const ambiguous = /^Option '(--[\w-]+)' argument is ambiguous/.exec(message);
  if (ambiguous) return `option ${ambiguous[1]} needs a value; what follows it looks like an option (write ${ambiguous[1]}=<value> to pass it anyway)`;
  const unknown = /^Unknown option '([^']+)'/.exec(message);
  if (unknown) return `unknown option ${unknown[1]}`;
  const missing = /^Option '(?:-\w, )?(--[\w-]+) <value>' argument missing/.exec(message);
  if (missing) return `option ${missing[1]} needs a value`;
  const flag = /^Option '(--[\w-]+)' does not take an argument/.exec(message);
  if (flag) return `option ${flag[1]} takes no value`;
  return message;
}

type Options = NonNullable<ParseArgsConfig["options"]>;

/** A command's arguments read by Node's parser, or, when they are bad, the exit status after one line saying so. */
export function commandArgs<O extends Options>(io: Pick<Io, "stderr">, command: string, argv: readonly string[], options: O): ReturnType<typeof parseArgs<{ args: string[]; allowPositionals: true; options: O }>> | number {
  try {
    return parseArgs({ args: [...argv], allowPositionals: true, options });
  } catch (e) {
    return badArgument(io, command, (e as Error).message);
  }
}
