/** The rule expression language: a SQL (ISO/IEC 9075) subset for asserts, whens and group asserts. */
export { compileExpression } from "./compile.js";
export { createAccumulator, createGroupTable, type GroupTable } from "./aggregate.js";
export { isFalse, isTrue } from "./truth.js";
export type { AggregateCall, CompileResult, CompiledExpr, ExprEnv, ExprType, ReferenceLookup } from "./types.js";
