import type { ColumnSpec } from "../contract/types.js";
import { compileType, formatValue, type TypeParser } from "../types/index.js";
import type { Value } from "../values.js";
import { VALUE_CANDIDATES, type Candidate } from "./candidates.js";
import { chooseType, type TypeChoice } from "./choose-type.js";
import { isEmail } from "./email.js";
import { KEY_ROW_CAP, type KeyCandidate } from "./key-tracker.js";
import { BLANK_MARKERS } from "./markers.js";
import { personalDataHint, suggestsDate } from "./names.js";
import type { Observation } from "./observe.js";
import { DISTINCT_CAP } from "./column-observer.js";
import { keyText } from "../engine/key-text.js";

/** A code list is proposed for a text column with at most this many distinct values... */
export const MAX_CODES = 12;
/** ...each seen this many times on average. */
export const CODE_REPEAT = 3;

/** One column of a draft: the spec to write and a remark on what was seen (no raw values when sensitive). */
export interface DraftColumn {
  readonly name: string;
  readonly spec: ColumnSpec;
  readonly remark: string;
}

/** A draft contract as decided from an observation, before it is written as YAML. */
export interface Draft {
  readonly rows: number;
  readonly format: "csv" | "tsv" | "ndjson";
  readonly delimiter?: string;
  readonly encoding: string;
  /** `input.blank`: "" and the markers seen where they could only mean "no value". */
  readonly blank: readonly string[];
  readonly columns: readonly DraftColumn[];
  /** The proposed key: one column, or columns unique together. */
  readonly key?: readonly string[];
  readonly duplicates: "error" | "warning";
  /** Remarks for the head of the draft (ragged records, caps, repeats, other unique columns). */
  readonly remarks: readonly string[];
  /** The remarks that mean `check` will not pass this very file against the draft. */
  readonly warnings: readonly string[];
}

interface Judged {
  readonly choice: TypeChoice;
  readonly candidate?: Candidate;
}

/** Decide every column, the blank markers, the key and the duplicates level from one observation. */
export function decideDraft(o: Observation): Draft {
  const judged: Judged[] = o.columns.map((s) => {
    const choice = chooseType(s, suggestsDate(s.name));
    return choice.kind === "value" ? { choice, candidate: VALUE_CANDIDATES[choice.index] as Candidate } : { choice };
  });
  // A marker is blank file-wide (input.blank) only if a typed column holds it, where it cannot be a value.
  const blankMarkers = new Set<string>();
  o.columns.forEach((s, c) => {
    if ((judged[c] as Judged).choice.kind === "text") return;
    s.markers.forEach((count, m) => {
      if (count > 0) blankMarkers.add(BLANK_MARKERS[m] as string);
    });
  });
  const blank = ["", ...BLANK_MARKERS.filter((m) => blankMarkers.has(m))];

  const columns = o.columns.map((s, c) => decideColumn(s, judged[c] as Judged, blankMarkers));
  const remarks: string[] = [];
  const warnings: string[] = [];
  if (o.ragged.count > 0) {
    warnings.push(`${o.ragged.count} record(s) have another number of cells than the header (the first at line ${o.ragged.firstLine}); they were left out, and check reports each as row.width.`);
    remarks.push(...warnings);
  }

  const specs = columns.map((c) => c.spec);
  const parsers = specs.map(parserOf);
  const candidates = o.keys.result((column, text) => {
    if (text === "" || blankMarkers.has(text)) return undefined;
    const parser = parsers[column];
    if (parser === undefined) return text;
    const v = parser.parse(text);
    return v === undefined ? text : keyText(v, text);
  });
  const keyOf = (k: KeyCandidate) => k.columns.map((c) => o.header[c] as string);
  const allRequired = (k: KeyCandidate) => k.columns.every((c) => specs[c]?.required === true);
  const primary = o.rows >= 2 ? candidates.slice(0, Math.min(2, o.header.length)).find((k) => k.outcome !== "repeats" && allRequired(k)) : undefined;
  let key: string[] | undefined;
  if (primary?.outcome === "unique") key = keyOf(primary);
  else if (primary?.outcome === "capped") {
    remarks.push(`${quoteList(keyOf(primary))} ${primary.columns.length > 1 ? "are unique together" : "is unique"} in the first ${KEY_ROW_CAP} rows; rows past that were not compared, so no key is proposed.`);
  }
  // Amounts and dates are unique by chance in small files; only identifier-like types are worth a mention.
  const idLike = (k: KeyCandidate) => k.columns.every((c) => specs[c]?.type === "text" || specs[c]?.type === "integer");
  const others = candidates.slice(Math.min(2, o.header.length)).filter((k) => k.outcome === "unique" && allRequired(k) && idLike(k) && !(key?.length === 1 && key[0] === keyOf(k)[0]));
  if (o.rows >= 2 && others.length > 0) remarks.push(`Also unique in every row of this file, not proposed as keys: ${quoteList(others.map((k) => keyOf(k)[0] as string))}.`);

  let duplicates: Draft["duplicates"] = "error";
  if (o.repeats.repeats > 0) {
    duplicates = "warning";
    remarks.push(`${o.repeats.repeats} row(s) repeat an earlier row exactly: duplicates is set to warning so that this file passes; make it error once they are explained.`);
  }
  if (o.repeats.capped) remarks.push(`Whole-row repeats were looked for in the first ${KEY_ROW_CAP} rows only.`);

  return {
    rows: o.rows,
    format: o.format,
    ...(o.delimiter === undefined ? {} : { delimiter: o.delimiter }),
    encoding: o.encoding,
    blank,
    columns,
    ...(key === undefined ? {} : { key }),
    duplicates,
    remarks,
    warnings,
  };
}

function decideColumn(s: Observation["columns"][number], j: Judged, blankMarkers: ReadonlySet<string>): DraftColumn {
  const notes: string[] = [];
  let blanks = s.empty;
  let values = s.values;
  const markerValues: string[] = [];
  s.markers.forEach((count, m) => {
    if (count === 0) return;
    const marker = BLANK_MARKERS[m] as string;
    if (blankMarkers.has(marker) || j.choice.kind !== "text") blanks += count;
    else {
      markerValues.push(marker);
      values += count;
    }
  });
  const personal = personalDataHint(s.name);
  let emails = s.emails;
  if (markerValues.length > 0) {
    // markers this column holds as ordinary text join its values
    emails = false;
    for (const m of markerValues) s.shape.add(m);
  }
  const distinct = new Set(s.distinct);
  for (const m of markerValues) distinct.add(m);
  let minLength = s.values === 0 ? Infinity : s.minLength;
  let maxLength = s.maxLength;
  for (const m of markerValues) {
    minLength = Math.min(minLength, m.length);
    maxLength = Math.max(maxLength, m.length);
  }
  const sensitive = personal !== undefined || (j.choice.kind === "text" && emails && values > 0);

  const spec: Record<string, unknown> = {};
  const choice = j.choice;
  if (choice.kind === "value") {
    const c = j.candidate as Candidate;
    Object.assign(spec, c.spec);
    if (c.spec.type === "decimal") {
      const lo = s.scaleLow[choice.index] as number;
      const hi = s.scaleHigh[choice.index] as number;
      if (hi > 0 && lo === hi) spec.scale = hi;
      else if (hi > 0) notes.push(`${lo} to ${hi} digits after the mark`);
    }
    if (!sensitive && c.spec.type !== "boolean") notes.push(range(s.low[choice.index] as Value, s.high[choice.index] as Value));
  } else if (choice.kind === "date") {
    spec.type = "date";
    spec.format = choice.formats.length === 1 ? choice.formats[0] : [...choice.formats];
    if (choice.alsoReads.length > 0) notes.push(`${choice.alsoReads.join(", ")} also read${choice.alsoReads.length === 1 ? "s" : ""} these values: confirm the format with the sender`);
    if (!sensitive) notes.push(range(choice.low, choice.high));
  } else spec.type = "text";

  if (values > 0 && blanks === 0) spec.required = true;
  if (spec.type === "text" && values > 0) {
    const codes = !sensitive && !s.distinctOverflow && distinct.size <= MAX_CODES && values >= CODE_REPEAT * distinct.size;
    // One distinct value gives no shape worth a pattern (`^John$`); two or more do.
    const pattern = s.distinctOverflow || distinct.size >= 2 ? s.shape.pattern(!sensitive) : undefined;
    if (emails && markerValues.every(isEmail)) spec.format = "email";
    else if (codes) {
      spec.codes = [...distinct].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
      if (pattern !== undefined) notes.push(`every value matches ${pattern}, if codes are too tight`);
    } else if (pattern !== undefined) spec.pattern = pattern;
    notes.push(s.distinctOverflow ? `over ${DISTINCT_CAP} distinct values` : `${distinct.size} distinct value${distinct.size === 1 ? "" : "s"}`);
    notes.push(minLength === maxLength ? `length ${maxLength}` : `length ${minLength} to ${maxLength}`);
  }
  if (sensitive) {
    spec.sensitive = true;
    notes.push(personal !== undefined ? `sensitive: the name suggests personal data (${personal})` : "sensitive: every value is an email address");
  }
  if (values === 0) notes.push(s.cells === 0 ? "no rows: type unknown" : "no values in this file: type unknown");
  else if (blanks > 0) notes.push(`${blanks} of ${s.cells} blank`);
  if (s.padded > 0) notes.push(`${s.padded} cell${s.padded === 1 ? "" : "s"} padded with spaces: check warns (${s.name}.spaces)`);
  return { name: s.name, spec: order(spec) as unknown as ColumnSpec, remark: notes.filter((n) => n !== "").join("; ") };
}

const KEY_ORDER = ["type", "required", "format", "codes", "pattern", "thousands", "decimal_mark", "percent", "scale", "sensitive"];

/** The spec's keys in one fixed order, so drafts read alike. */
function order(spec: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const k of KEY_ORDER) if (spec[k] !== undefined) out[k] = spec[k];
  return out;
}

function range(low: Value, high: Value): string {
  if (low === null || high === null) return "";
  const a = formatValue(low);
  const b = formatValue(high);
  return a === b ? `observed ${a} only` : `observed ${a} to ${b}`;
}

/** The parser of a decided column as the check will build it; text needs none. */
function parserOf(spec: ColumnSpec): TypeParser | undefined {
  if (spec.type === "text") return undefined;
  const c = compileType(spec);
  return c.ok ? c.parser : undefined;
}


function quoteList(names: readonly string[]): string {
  return names.map((n) => JSON.stringify(n)).join(", ");
}
