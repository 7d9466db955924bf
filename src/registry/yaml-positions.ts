import { isMap, isScalar, type Document, type LineCounter, type Node } from "yaml";
import type { Problem } from "../problem.js";

/** Where a problem sits in a parsed YAML file: the node at `path`, or its key, or the nearest parent. */
export function problemAtPath(
  file: string,
  doc: Document.Parsed,
  lines: LineCounter,
  path: readonly (string | number)[],
  message: string,
  onKey = false,
): Problem {
  let node: Node | null = doc.contents;
  let keyNode: Node | null = null;
  for (const step of path) {
    if (!isMap(node)) break;
    const pair = node.items.find((p) => isScalar(p.key) && String(p.key.value) === String(step));
    if (!pair) break;
    keyNode = isScalar(pair.key) ? pair.key : null;
    node = (pair.value as Node | null) ?? keyNode;
  }
  const target = onKey && keyNode ? keyNode : node;
  const offset = target?.range?.[0];
  if (offset === undefined) return { file, line: 1, column: 1, message };
  const pos = lines.linePos(offset);
  return { file, line: pos.line, column: pos.col, message };
}

/** Split an ajv instancePath (a JSON Pointer) into keys, undoing RFC 6901 escapes. */
export function pointerKeys(pointer: string): string[] {
  if (pointer === "") return [];
  return pointer.slice(1).split("/").map((s) => s.replace(/~1/g, "/").replace(/~0/g, "~"));
}
