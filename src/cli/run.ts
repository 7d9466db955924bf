import { check, CHECK_USAGE } from "./check.js";
import { fix, FIX_USAGE } from "./fix.js";
import { infer, INFER_USAGE } from "./infer.js";
import { EXIT, type Io } from "./io.js";
import { lint, LINT_USAGE } from "./lint.js";
import { badArgument } from "./problems.js";
import { ref, REF_USAGE } from "./ref.js";
import { schema, SCHEMA_USAGE } from "./schema.js";

export type { Io } from "./io.js";

type Command = (argv: readonly string[], io: Io) => Promise<number>;

const COMMANDS: Readonly<Record<string, Command>> = { check, fix, lint, ref, schema, infer };

const USAGE = `usage:
  ${CHECK_USAGE}
  ${LINT_USAGE}
  ${REF_USAGE}
  ${FIX_USAGE}
  ${SCHEMA_USAGE}
  ${INFER_USAGE}
`;

/**
 * The command line as a function: arguments and an Io in, exit status out. Never throws: an
 * unexpected failure is one line on stderr and status 2.
 */
export async function run(argv: readonly string[], io: Io): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined) return badArgument(io, "", `no command given; expected one of ${Object.keys(COMMANDS).join(", ")}`);
  if (name === "help" || name === "--help" || name === "-h") {
    io.stdout(USAGE);
    return EXIT.pass;
  }
  if (name === "--version") {
    io.stdout("0.1.0\n");
    return EXIT.pass;
  }
  const command = Object.hasOwn(COMMANDS, name) ? COMMANDS[name] : undefined;
  if (!command) return badArgument(io, "", `unknown command "${name}"; expected one of ${Object.keys(COMMANDS).join(", ")}`);
  try {
    return await command(rest, io);
  } catch (e) {
    io.stderr(`tablegate: internal error: ${(e as Error).message ?? String(e)} (please report it)\n`);
    return EXIT.unusable;
  }
}
