import { parse } from "yaml";
import { expect } from "vitest";
import type { ColumnSpec, ContractSpec } from "../../src/contract/types.js";
import { runCli, type CliRun, type FileSet } from "../helpers/cli.js";

/** `tablegate infer` over one file in a fresh project folder; the draft parsed when it printed one. */
export async function inferFile(data: string | Uint8Array, fileName = "d.csv", args: readonly string[] = [], extra: FileSet = {}): Promise<CliRun & { readonly contract: ContractSpec }> {
  const r = await runCli(["infer", fileName, ...args], { [fileName]: data, ...extra });
  const contract = (r.code === 0 ? parse(r.stdout) : undefined) as ContractSpec;
  return { ...r, contract };
}

/** The draft's spec of one column, failing the test when the draft lacks it. */
export function column(contract: ContractSpec, name: string): ColumnSpec {
  const spec = contract.columns[name];
  expect(spec, `column ${name} in the draft`).toBeDefined();
  return spec as ColumnSpec;
}

/** Infer a draft from a file, then check the same file against it: the run must pass (exit 0). */
export async function roundTrip(data: string | Uint8Array, fileName = "d.csv"): Promise<{ readonly infer: CliRun; readonly check: CliRun; readonly contract: ContractSpec }> {
  const inferred = await inferFile(data, fileName);
  expect(inferred.code, inferred.stderr).toBe(0);
  const check = await runCli(["check", fileName, "--contract", "draft.contract.yaml", "--report", "json=-"], { [fileName]: data, "draft.contract.yaml": inferred.stdout });
  return { infer: inferred, check, contract: inferred.contract };
}

/** Rows of a CSV built from a header and rows of cells, quoted as RFC 4180 requires. */
export function csv(header: readonly string[], rows: readonly (readonly string[])[]): string {
  const cell = (c: string) => (/[",\r\n]/.test(c) ? `"${c.replace(/"/g, '""')}"` : c);
  return [header, ...rows].map((r) => r.map(cell).join(",")).join("\n") + "\n";
}

/** One column of values under a header, as CSV text. */
export function oneColumn(name: string, values: readonly string[]): string {
  return csv([name], values.map((v) => [v]));
}
