/** Syntax tree of a rule expression; every node keeps its source span [start, end). */

/** Binary operators, as written (`!=` is kept apart from `<>` only for messages). */
export type BinaryOp = "+" | "-" | "*" | "/" | "%" | "||" | "=" | "<>" | "<" | "<=" | ">" | ">=";

interface Span {
  readonly start: number;
  readonly end: number;
}

/** One node of the tree, discriminated by `type`. */
export type Node =
  | (Span & { readonly type: "number"; readonly value: number })
  | (Span & { readonly type: "text"; readonly value: string })
  | (Span & { readonly type: "boolean"; readonly value: boolean })
  | (Span & { readonly type: "null" })
  | (Span & { readonly type: "typed"; readonly kind: "date" | "time" | "timestamp"; readonly text: Node & { type: "text" } })
  | (Span & { readonly type: "column"; readonly name: string; readonly quoted: boolean })
  | (Span & { readonly type: "call"; readonly name: string; readonly nameEnd: number; readonly args: readonly Node[]; readonly star: boolean })
  | (Span & { readonly type: "unary"; readonly op: "-" | "+" | "not"; readonly operand: Node })
  | (Span & { readonly type: "binary"; readonly op: BinaryOp; readonly opStart: number; readonly left: Node; readonly right: Node })
  | (Span & { readonly type: "logical"; readonly op: "and" | "or"; readonly left: Node; readonly right: Node })
  | (Span & { readonly type: "is"; readonly negated: boolean; readonly test: "null" | "true" | "false" | "unknown"; readonly operand: Node })
  | (Span & { readonly type: "distinct"; readonly negated: boolean; readonly left: Node; readonly right: Node })
  | (Span & { readonly type: "between"; readonly negated: boolean; readonly operand: Node; readonly low: Node; readonly high: Node })
  | (Span & { readonly type: "in"; readonly negated: boolean; readonly operand: Node; readonly items: readonly Node[] })
  | (Span & { readonly type: "like"; readonly negated: boolean; readonly operand: Node; readonly pattern: Node; readonly escape: Node | null })
  | (Span & {
      readonly type: "case";
      readonly subject: Node | null;
      readonly branches: readonly { readonly when: Node; readonly then: Node }[];
      readonly otherwise: Node | null;
    });

/** A node of one kind. */
export type NodeOf<T extends Node["type"]> = Extract<Node, { type: T }>;
