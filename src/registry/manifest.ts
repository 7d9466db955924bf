import type { ErrorObject } from "ajv";
import { schemaValidator } from "../schema/validator.js";
import { isScalar } from "yaml";
import { pointerPath } from "../contract/schema-errors.js";
import { parseYamlSource, problemAt, yamlData, type YamlPath, type YamlSource } from "../contract/yaml-source.js";
import { fail, ok, type Problem, type Result } from "../problem.js";

/** Types a registry column may declare; cells are checked against them when the table loads. */
export type RefColumnType = "text" | "integer" | "decimal" | "boolean" | "date";

/** A 1-based place in a file. */
export interface Position {
  readonly line: number;
  readonly column: number;
}

/** One table entry of a registry.yaml, validated against src/schema/registry.schema.json. */
export interface ManifestTable {
  readonly name: string;
  /** the CSV path as written, relative to the manifest's folder */
  readonly file: string;
  readonly key: string;
  readonly version: string;
  readonly source?: string;
  readonly description?: string;
  /** declared columns in manifest order; undefined when the manifest declares none (all text) */
  readonly columns?: readonly { readonly name: string; readonly type: RefColumnType }[];
  /** where the table's name, `key` and `columns` are written, for later problems */
  readonly at: { readonly name: Position; readonly file: Position; readonly key: Position; readonly columns: Position };
}


function describe(e: ErrorObject): { message: string; onKey: boolean; extra?: string } {
  const p = e.params as Record<string, unknown>;
  switch (e.keyword) {
    case "additionalProperties":
      return { message: `unknown key "${String(p.additionalProperty)}"`, onKey: true, extra: String(p.additionalProperty) };
    case "required":
      return { message: `missing required key "${String(p.missingProperty)}"`, onKey: true };
    case "propertyNames":
      return { message: `table name "${String(p.propertyName)}" must be lower-case letters, digits and single hyphens`, onKey: true, extra: String(p.propertyName) };
    case "pattern":
      return { message: "file must be a relative .csv path inside the registry folder", onKey: false };
    default:
      return { message: e.message ?? e.keyword, onKey: false };
  }
}

/** A problem at the node `path` leads to, or at the key of its last step. */
function problemAtPath(src: YamlSource, path: YamlPath, message: string, onKey = false): Problem {
  const last = path[path.length - 1];
  return onKey && last !== undefined ? problemAt(src, path.slice(0, -1), message, { key: String(last) }) : problemAt(src, path, message);
}

/** Parse and validate a registry manifest; every problem carries file:line:col. Never throws. */
export function parseManifest(text: string, file: string): Result<ManifestTable[]> {
  const src = parseYamlSource(file, text);
  if (src.syntaxProblems.length > 0) return fail(...src.syntaxProblems);
  const read = yamlData(src);
  if (!read.ok) return read;
  const data = read.value;
  const validator = schemaValidator("registry");
  if (!validator.valid(data)) {
    const problems: Problem[] = [];
    const seen = new Set<string>();
    const errors = validator.errors(data);
    for (const e of errors) {
      // the propertyNames error already covers the failed pattern of the name
      if (e.propertyName !== undefined) continue;
      // anyOf branches repeat what the branch errors already say
      if (e.keyword === "anyOf" && errors.some((o) => o !== e && o.instancePath === e.instancePath)) continue;
      const d = describe(e);
      const path: (string | number)[] = pointerPath(e.instancePath);
      if (d.extra !== undefined) path.push(d.extra);
      const problem = problemAtPath(src, path, d.message, d.onKey);
      const id = `${problem.line}:${problem.column}:${problem.message}`;
      if (!seen.has(id)) {
        seen.add(id);
        problems.push(problem);
      }
    }
    return fail(...problems);
  }
  const tables = (data as { tables: Record<string, Record<string, unknown>> }).tables;
  const out: ManifestTable[] = [];
  const pos = (path: (string | number)[], onKey = false): Position => {
    const p = problemAtPath(src, path, "", onKey);
    return { line: p.line ?? 1, column: p.column ?? 1 };
  };
  for (const [name, t] of Object.entries(tables)) {
    const versionNode = src.doc.getIn(["tables", name, "version"], true);
    // A YAML number such as 2026.10 would read back as 2026.1: keep the text as written.
    const version = isScalar(versionNode) && typeof versionNode.value === "number" && versionNode.range
      ? text.slice(versionNode.range[0], versionNode.range[1])
      : String(t.version);
    const cols = t.columns as Record<string, RefColumnType | { type: RefColumnType }> | undefined;
    out.push({
      name,
      file: String(t.file),
      key: String(t.key),
      version,
      ...(typeof t.source === "string" ? { source: t.source } : {}),
      ...(typeof t.description === "string" ? { description: t.description } : {}),
      ...(cols ? { columns: Object.entries(cols).map(([c, v]) => ({ name: c, type: typeof v === "string" ? v : v.type })) } : {}),
      at: { name: pos(["tables", name], true), file: pos(["tables", name, "file"]), key: pos(["tables", name, "key"]), columns: pos(["tables", name, "columns"]) },
    });
  }
  return ok(out);
}
