/**
 * tablegate as a library: compile a contract, check a delivery, write a report. The command line
 * (`run`) is built from the same pieces.
 */
export { checkFile, type CheckOptions } from "./check.js";
export { compileContract, loadContract, type LoadOptions } from "./contract/load.js";
export type { Plan } from "./contract/plan.js";
export type { ContractSpec, ColumnSpec, Level } from "./contract/types.js";
export { loadRegistry, type Registry, type RefTable } from "./registry/index.js";
export { WRITERS, type ReportFormat } from "./report/formats.js";
export type { WriterContext } from "./report/writer.js";
export type { CheckTally, DeliveryReport, Finding } from "./report/model.js";
export { formatProblem, type Problem, type Result } from "./problem.js";
export { schemaPath } from "./schema/locate.js";
export { run, type Io } from "./cli/run.js";
