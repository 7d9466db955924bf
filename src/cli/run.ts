import { check, CHECK_USAGE } from "./check.js";
import { fix, FIX_USAGE } from "./fix.js";
import { infer, INFER_USAGE } from "./infer.js";
import { EXIT, type Io } from "./io.js";
import { lint } from "./lint.js";
import { ref, REF_USAGE } from "./ref.js";
import { schema } from "./schema.js";

export type { Io } from "./io.js";

type Command = (argv: readonly string[], io: Io) => Promise<number>;

const COMMANDS: Readonly<Record<string, Command>> = { check, fix, lint, ref, schema, infer };

const USAGE = `usage:
  ${CHECK_USAGE}
  tablegate lint <contract...>
  ${REF_USAGE}
  ${FIX_USAGE}
  tablegate schema [contract|report]
  ${INFER_USAGE}
`;

/**
 * The command line as a function: arguments and an Io in, exit status out. Never throws: an
 * unexpected failure is one line on stderr and status 2.
 */
export async function run(argv: readonly string[], io: Io): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined || name === "help" || name === "--help" || name === "-h") {
    (name === undefined ? io.stderr : io.stdout)(USAGE);
    return name === undefined ? EXIT.unusable : EXIT.pass;
  }
  if (name === "--version") {
    io.stdout("0.1.0\n");
    return EXIT.pass;
  }
  const command = COMMANDS[name];
  if (!command) {
    io.stderr(`tablegate: unknown command "${name}"\n${USAGE}`);
    return EXIT.unusable;
  }
  try {
    return await command(rest, io);
  } catch (e) {
    io.stderr(`tablegate: internal error: ${(e as Error).message ?? String(e)} (please report it)\n`);
    return EXIT.unusable;
  }
}
