import { schemaPath } from "../schema/locate.js";
import { EXIT, type Io } from "./io.js";
import { badArgument, commandArgs, showUsage } from "./problems.js";

export const SCHEMA_USAGE = "tablegate schema [contract|report]";

/** `tablegate schema [report]`: print the path of the contract (or report) JSON Schema. */
export async function schema(argv: readonly string[], io: Io): Promise<number> {
  const parsed = commandArgs(io, "schema", argv, { help: { type: "boolean", short: "h" } });
  if (typeof parsed === "number") return parsed;
  if (parsed.values.help === true) return showUsage(io, SCHEMA_USAGE);
  const [which = "contract", ...extra] = parsed.positionals;
  if (which !== "contract" && which !== "report") return badArgument(io, "schema", `schema takes "contract" or "report", got ${JSON.stringify(which)}`);
  if (extra.length > 0) return badArgument(io, "schema", `schema takes one argument, "contract" or "report"; unexpected ${extra.map((a) => JSON.stringify(a)).join(", ")}`);
  io.stdout(schemaPath(`${which}.schema.json`) + "\n");
  return EXIT.pass;
}
