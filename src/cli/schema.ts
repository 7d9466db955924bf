import { schemaPath } from "../schema/locate.js";
import { EXIT, type Io } from "./io.js";

/** `tablegate schema [report]`: print the path of the contract (or report) JSON Schema. */
export async function schema(argv: readonly string[], io: Io): Promise<number> {
  const which = argv[0] ?? "contract";
  if (which !== "contract" && which !== "report") {
    io.stderr(`tablegate: schema takes "contract" or "report", got ${JSON.stringify(which)}\n`);
    return EXIT.unusable;
  }
  io.stdout(schemaPath(`${which}.schema.json`) + "\n");
  return EXIT.pass;
}
