import { fullFormats } from "ajv-formats/dist/formats.js";
import { suggestion } from "../contract/near-miss.js";
import { miss, type CheckDefinition } from "./definition.js";

type FormatDef = (typeof fullFormats)[keyof typeof fullFormats];

/** The JSON Schema string formats, as implemented by ajv-formats; numeric and no-op formats are left out. */
export const TEXT_FORMATS = [
  "date", "time", "date-time", "iso-time", "iso-date-time", "duration", "uri", "uri-reference", "uri-template", "url",
  "email", "hostname", "ipv4", "ipv6", "regex", "uuid", "json-pointer", "json-pointer-uri-fragment", "relative-json-pointer", "byte",
] as const;

function validator(def: FormatDef): (text: string) => boolean {
  const v = typeof def === "object" && !(def instanceof RegExp) ? def.validate : def;
  if (v instanceof RegExp) return (text) => v.test(text);
  if (typeof v === "function") return (text) => Boolean((v as (s: string) => unknown)(text));
  return () => true;
}

/** `format` on a text column: a JSON Schema format name (email, uri, uuid, ipv4, ...) from ajv-formats. */
export const format: CheckDefinition = {
  name: "format",
  key: "format",
  types: ["text"],
  compile(spec, ctx) {
    const name = spec.format;
    if (typeof name !== "string" || !(TEXT_FORMATS as readonly string[]).includes(name)) {
      return [{ path: ["format"], message: `unknown text format ${JSON.stringify(name)}${suggestion(String(name), TEXT_FORMATS)}; known: ${TEXT_FORMATS.join(", ")}` }];
    }
    const test = validator(fullFormats[name as keyof typeof fullFormats]);
    const m = miss(`a valid ${name}`, `is not a valid ${name}`);
    return { description: `${ctx.column} is a valid ${name}`, test: (_v, text) => (test(text) ? undefined : m) };
  },
};
