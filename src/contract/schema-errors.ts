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

/** The ajv keywords this file words for a person; a keyword the contract schema uses must be here. */
export const WORDED_KEYWORDS: ReadonlySet<string> = new Set([
  "additionalProperties", "anyOf", "const", "enum", "exclusiveMinimum", "maxLength", "maximum", "minItems",
  "minLength", "minProperties", "minimum", "pattern", "required", "type",
]);

const VERSION_PATTERN = "^[0-9]+\\.[0-9]+\\.[0-9]+([-+][0-9A-Za-z.-]+)?$";

// The schema's patterns said in words (src/schema/contract.schema.json), as what was expected.
const PATTERN_WORDS: Readonly<Record<string, string>> = {
  "^[a-z0-9][a-z0-9-]*$": "a name of lower-case letters, digits and dashes, starting with a letter or digit",
  "^[a-z0-9][a-z0-9_-]*$": "an id of lower-case letters, digits, dashes and underscores, starting with a letter or digit",
  [VERSION_PATTERN]: 'a version such as "1.0.0" (three whole numbers joined by dots, optionally followed by -label or +build)',
};

// What an empty text should have been, by the key that holds it (or, for a list item, the list's key).
const EMPTY_WORDS: Readonly<Record<string, string>> = {
  assert: "an empty expression; write the condition each row must meet",
  when: "an empty condition; write the condition that picks the rows this applies to, or leave when out",
  pattern: "an empty pattern; write the regular expression each value must match",
  postal: "an empty postal setting; name the column holding ISO 3166-1 alpha-2 country codes, or give one such code",
  table: "an empty table name; name a reference table",
  column: "an empty column name; name a declared column",
  keys: "an empty column name; name a declared column",
  by: "an empty column name; name a declared column",
  format: "an empty format; name a format",
  min: "an empty bound; give a number, or a date or time as text",
  max: "an empty bound; give a number, or a date or time as text",
  true: "an empty spelling; list the texts that mean true",
  false: "an empty spelling; list the texts that mean false",
};

/** The key a value sits under: its own key, or for a list item the key of the list. */
function keyOf(path: readonly string[]): string {
  for (let i = path.length - 1; i >= 0; i--) if (!/^\d+$/.test(path[i] ?? "")) return path[i] ?? "";
  return "";
}

/** The value as written in the file (`1.0`, not the 1 YAML made of it), when it is a scalar there. */
function sourceText(src: YamlSource, path: readonly string[], value: unknown): string {
  const node: unknown = src.doc.getIn(path, true);
  const range = (node as { range?: readonly number[] } | undefined)?.range;
  const written = range === undefined ? undefined : src.text.slice(range[0], range[1]).trim();
  return written !== undefined && written !== "" && !/[\n{}[\],]/.test(written) ? written : String(value);
}

/** "expected text" said for a number or true/false that YAML read from an unquoted value. */
function quoteHint(src: YamlSource, path: readonly string[], value: unknown): string {
  const written = sourceText(src, path, value);
  return `quote it: YAML reads ${written} as ${typeof value === "boolean" ? "true or false" : "a number"}`;
}

/** A numeric limit in words: "a number from 0 to 1", "a whole number of 0 or more". */
function rangeWords(schema: SchemaNode | undefined): string {
  const kind = schema?.type === "integer" ? "a whole number" : "a number";
  const { minimum: min, maximum: max, exclusiveMinimum: above } = schema ?? {};
  if (min !== undefined && max !== undefined) return `${kind} from ${String(min)} to ${String(max)}`;
  if (above !== undefined) return `${kind} greater than ${String(above)}`;
  if (max !== undefined) return `${kind} of ${String(max)} or less`;
  return `${kind} of ${String(min)} or more`;
}

/**
 * One unknown key and one missing required key in the same map, the first a typo of the second
 * ("flase" for "false"): one mistake, said once at the unknown key. Keyed by the map's instance path.
 */
function typoPairs(errors: readonly ErrorObject[]): Map<string, { unknown: string; missing: string }> {
  const byMap = new Map<string, { unknown: string[]; missing: string[] }>();
  const at = (path: string) => {
    let keys = byMap.get(path);
    if (!keys) byMap.set(path, (keys = { unknown: [], missing: [] }));
    return keys;
  };
  for (const e of errors) {
    if (e.keyword === "additionalProperties") at(e.instancePath).unknown.push(String(e.params.additionalProperty));
    if (e.keyword === "required") at(e.instancePath).missing.push(String(e.params.missingProperty));
  }
  const pairs = new Map<string, { unknown: string; missing: string }>();
  for (const [path, { unknown: [unknown, ...moreUnknown], missing: [missing, ...moreMissing] }] of byMap) {
    if (unknown === undefined || missing === undefined || moreUnknown.length > 0 || moreMissing.length > 0) continue;
    if (nearMiss(unknown, [missing]) === missing) pairs.set(path, { unknown, missing });
  }
  return pairs;
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
  const typos = typoPairs(errors);
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
    const parent = e.parentSchema as SchemaNode | undefined;
    const key = keyOf(path);
    switch (e.keyword) {
      case "additionalProperties": {
        const name = String(e.params.additionalProperty);
        const typo = typos.get(here);
        if (typo?.unknown === name) {
          push(path, `unknown key "${name}"; did you mean "${typo.missing}"?`, name);
          break;
        }
        const allowed = allowedKeys(e.parentSchema);
        push(path, `unknown key "${name}"${suggestion(name, allowed)}; allowed here: ${allowed.join(", ")}`, name);
        break;
      }
      case "required": {
        // A misspelt key ("contarct") is one mistake: its unknown-key message names the right one.
        const missing = String(e.params.missingProperty);
        const misspelt = typos.get(here)?.missing === missing || errors.some((o) => o.keyword === "additionalProperties" && o.instancePath === e.instancePath && nearMiss(String(o.params.additionalProperty), [missing]) === missing);
        if (!misspelt) push(path, `missing required key "${missing}"`);
        break;
      }
      case "type": {
        const wantsText = e.params.type === "string" && (typeof value === "number" || typeof value === "boolean");
        if (wantsText && parent?.pattern === VERSION_PATTERN) push(path, `expected a version as text such as "1.0.0" (${quoteHint(src, path, value)})`);
        else if (wantsText) push(path, `expected text; got ${sourceText(src, path, value)} (${quoteHint(src, path, value)})`);
        else if (value === null) push(path, `expected ${typeWords(e.params.type)}; got nothing: write a value after the colon, or leave the key out`);
        else push(path, `expected ${typeWords(e.params.type)}; got ${describeValue(value)}`);
        break;
      }
      case "enum": {
        const allowed = (e.params.allowedValues as unknown[]).map(String);
        push(path, `${describeValue(value)} is not allowed${suggestion(String(value), allowed)}; expected one of: ${allowed.join(", ")}`);
        break;
      }
      case "const": {
        const about = typeof parent?.description === "string" ? ` (${parent.description.replace(/\.$/, "").toLowerCase()})` : "";
        push(path, `expected ${describeValue(e.params.allowedValue)}${about}; got ${describeValue(value)}`);
        break;
      }
      case "minItems":
        push(path, Number(e.params.limit) === 1 ? "an empty list: give at least one item" : `a list of at least ${String(e.params.limit)} items is needed here`);
        break;
      case "pattern": {
        const wanted = PATTERN_WORDS[String(e.params.pattern)] ?? `text of the form ${String(e.params.pattern)}`;
        push(path, `expected ${wanted}; got ${describeValue(value)}`);
        break;
      }
      case "minLength":
        if (Number(e.params.limit) === 1 && (key === "delimiter" || key === "quote")) push(path, `${key} must be one character, got ""`);
        else if (Number(e.params.limit) === 1) push(path, EMPTY_WORDS[key] ?? "an empty text; write a value here, or leave the key out");
        else push(path, `${describeValue(value)} is too short; write at least ${String(e.params.limit)} characters`);
        break;
      case "maxLength":
        push(path, Number(e.params.limit) === 1 ? `${key} must be one character, got ${describeValue(value)}` : `${describeValue(value)} is too long; write at most ${String(e.params.limit)} characters`);
        break;
      case "minProperties":
        push(path, key === "columns" ? "columns: lists no columns; declare at least one" : `an empty map; give at least ${String(e.params.limit)} key${Number(e.params.limit) === 1 ? "" : "s"}`);
        break;
      case "minimum":
      case "maximum":
      case "exclusiveMinimum": {
        const share = key === "allow" || path.includes("blank_share") ? " (a share of rows)" : "";
        push(path, `expected ${rangeWords(parent)}${share}; got ${describeValue(value)}`);
        break;
      }
      default:
        // Reached only by a keyword added to the schema without wording here (see WORDED_KEYWORDS).
        push(path, `${describeValue(value)} is not allowed here (${e.keyword})`);
    }
  }
  return out;
}
