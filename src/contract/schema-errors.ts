import type { ErrorObject } from "ajv";
import type { Problem } from "../problem.js";
import { nearMiss, suggestion } from "./near-miss.js";
import { problemAt, type YamlPath, type YamlSource } from "./yaml-source.js";

type SchemaNode = Record<string, unknown>;

/** Split a JSON Pointer into path segments (RFC 6901 unescaping). */
export function pointerPath(pointer: string): string[] {
  if (pointer === "") return [];
  return pointer.slice(1).split("/").map((s) => s.replace(/~1/g, "/").replace(/~0/g, "~"));
}

function describeValue(v: unknown): string {
  if (v === null) return "null";
  if (Array.isArray(v)) return "a list";
  if (typeof v === "object") return "a map";
  if (typeof v === "string") return `"${v}"`;
  return String(v);
}

function typeWords(types: unknown): string {
  const list = Array.isArray(types) ? types : [types];
  const words: Record<string, string> = { object: "a map", array: "a list", string: "text", number: "a number", integer: "a whole number", boolean: "true or false", null: "null" };
  return list.map((t) => words[String(t)] ?? String(t)).join(" or ");
}

function valueAt(data: unknown, path: readonly string[]): unknown {
  let v = data;
  for (const k of path) v = v !== null && typeof v === "object" ? (v as Record<string, unknown>)[k] : undefined;
  return v;
}

function allowedKeys(schema: unknown): string[] {
  const props = (schema as SchemaNode | undefined)?.properties;
  return props && typeof props === "object" ? Object.keys(props) : [];
}

/**
 * Turn ajv's errors into one problem per place, worded for a person and positioned in the YAML.
 * Alternatives (anyOf) that failed only because of their type collapse into one "expected A or B".
 */
export function schemaProblems(src: YamlSource, data: unknown, errors: readonly ErrorObject[]): Problem[] {
  // A branch of an anyOf matched the value's shape when it has errors inside the value, or about the
  // value's own keys (a map missing a required key): those say more than "expected a list".
  const SHAPE_BLIND = new Set(["type", "enum", "const", "anyOf", "oneOf"]);
  const deeper = (path: string) =>
    errors.some((e) => e.keyword !== "anyOf" && (e.instancePath.startsWith(path + "/") || (e.instancePath === path && !SHAPE_BLIND.has(e.keyword))));
  const anyOfAt = new Set(errors.filter((e) => e.keyword === "anyOf").map((e) => e.instancePath));
  const out: Problem[] = [];
  const seen = new Set<string>();
  const push = (path: YamlPath, message: string, key?: string) => {
    const p = problemAt(src, path, message, key === undefined ? {} : { key });
    const id = `${p.line}:${p.column}:${message}`;
    if (!seen.has(id)) {
      seen.add(id);
      out.push(p);
    }
  };
  const anyOfTypes = new Map<string, Set<string>>();
  for (const e of errors) {
    const path = pointerPath(e.instancePath);
    const value = valueAt(data, path);
    const here = e.instancePath;
    if (anyOfAt.has(here) && (e.keyword === "type" || e.keyword === "enum" || e.keyword === "const" || e.keyword === "anyOf")) {
      if (deeper(here)) continue; // a branch matched the shape; its inner errors say more
      const words = anyOfTypes.get(here) ?? new Set<string>();
      if (e.keyword === "type") words.add(typeWords(e.params.type));
      if (e.keyword === "enum") words.add((e.params.allowedValues as unknown[]).join(" | "));
      anyOfTypes.set(here, words);
      if (e.keyword !== "anyOf") continue;
      push(path, `expected ${[...words].join(", or ")}; got ${describeValue(value)}`);
      continue;
    }
    switch (e.keyword) {
      case "additionalProperties": {
        const name = String(e.params.additionalProperty);
        const allowed = allowedKeys(e.parentSchema);
        push(path, `unknown key "${name}"${suggestion(name, allowed)}; allowed here: ${allowed.join(", ")}`, name);
        break;
      }
      case "required": {
        // A misspelt key ("contarct") is one mistake: its unknown-key message names the right one.
        const missing = String(e.params.missingProperty);
        const misspelt = errors.some((o) => o.keyword === "additionalProperties" && o.instancePath === e.instancePath && nearMiss(String(o.params.additionalProperty), [missing]) === missing);
        if (!misspelt) push(path, `missing required key "${missing}"`);
        break;
      }
      case "type":
        push(path, `expected ${typeWords(e.params.type)}; got ${describeValue(value)}`);
        break;
      case "enum": {
        const allowed = (e.params.allowedValues as unknown[]).map(String);
        push(path, `${describeValue(value)} is not allowed${suggestion(String(value), allowed)}; expected one of: ${allowed.join(", ")}`);
        break;
      }
      case "const":
        push(path, `expected ${describeValue(e.params.allowedValue)}; got ${describeValue(value)}`);
        break;
      case "minItems":
        push(path, Number(e.params.limit) === 1 ? "an empty list: give at least one item" : `a list of at least ${String(e.params.limit)} items is needed here`);
        break;
      case "pattern":
        push(path, `${describeValue(value)} does not match ${String(e.params.pattern)}`);
        break;
      default:
        push(path, `${describeValue(value)} ${e.message ?? "is not valid here"}`);
    }
  }
  return out;
}
