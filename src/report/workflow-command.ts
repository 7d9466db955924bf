// Escaping of GitHub Actions workflow commands, as in the actions/toolkit core package
// (escapeData / escapeProperty): '%' first, then CR and LF; properties also ':' and ','.

/** The message part of a workflow command, after '::'. */
export const escapeData = (s: string): string => s.replace(/%/g, "%25").replace(/\r/g, "%0D").replace(/\n/g, "%0A");

/** A property value such as file= or title=. */
export const escapeProperty = (s: string): string => escapeData(s).replace(/:/g, "%3A").replace(/,/g, "%2C");

/** One workflow command line, e.g. `::error file=a.csv,line=3,title=qty.max::qty too large`. */
export function workflowCommand(command: string, props: readonly (readonly [string, string | number])[], message: string): string {
  const p = props.map(([k, v]) => `${k}=${escapeProperty(String(v))}`).join(",");
  return `::${command}${p === "" ? "" : ` ${p}`}::${escapeData(message)}`;
}
