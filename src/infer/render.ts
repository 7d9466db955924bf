import { Document, isMap, isSeq, type Node } from "yaml";
import type { Draft } from "./decide.js";

/** What the head of a draft says about where it came from. */
export interface RenderOptions {
  /** The contract name, [a-z0-9-]+. */
  readonly name: string;
  /** The delivery as the user named it. */
  readonly file: string;
  /** `$schema` for the yaml-language-server line. */
  readonly schema: string;
}

/**
 * The draft as a contract file: a schema line, a head comment saying what it was inferred from and on
 * what basis, then `tablegate`, `name`, `version`, `input`, one flow map per column (in file order),
 * `keys` and `duplicates`. Built with the yaml package, so every scalar is quoted as YAML needs.
 */
export function renderDraft(draft: Draft, options: RenderOptions): string {
  const input: Record<string, unknown> = { format: draft.format };
  if (draft.delimiter !== undefined) input.delimiter = draft.delimiter;
  input.encoding = draft.encoding;
  input.header = "exact";
  input.blank = [...draft.blank];
  const contract: Record<string, unknown> = { tablegate: 1, name: options.name, version: "0.1.0", input, columns: {} };
  if (draft.key !== undefined) contract.keys = [draft.key.length === 1 ? draft.key[0] : [...draft.key]];
  contract.duplicates = draft.duplicates;

  const doc = new Document(contract);
  const blankNode = doc.getIn(["input", "blank"], true);
  if (isSeq(blankNode)) blankNode.flow = true;
  const columns = doc.get("columns", true);
  if (!isMap(columns)) return "";
  for (const c of draft.columns) {
    const node = doc.createNode(c.spec) as Node;
    if (isMap(node)) {
      node.flow = true;
      for (const item of node.items) if (isSeq(item.value)) item.value.flow = true;
    }
    if (c.remark !== "") node.comment = ` ${commentText(c.remark)}`;
    columns.add(doc.createPair(c.name, node));
  }
  const keys = doc.get("keys", true);
  if (isSeq(keys)) for (const k of keys.items) if (isSeq(k)) k.flow = true;

  const head = [
    ` yaml-language-server: $schema=${commentText(options.schema)}`,
    ` Draft contract inferred by tablegate infer from ${draft.rows} row${draft.rows === 1 ? "" : "s"} of ${commentText(JSON.stringify(options.file))}.`,
    " Basis: each column has the first type that reads every non-blank cell; required where no cell is",
    " blank; codes for text with at most 12 distinct values each seen 3 times on average; a pattern where",
    " every text has one shape; a key when the first column, or the first two, are unique in every row.",
    " min and max are left out on purpose: ranges are business decisions. Observed ranges are noted beside",
    " each column. Review every line before use.",
    ...draft.remarks.map((r) => ` Note: ${commentText(r)}`),
  ];
  doc.commentBefore = head.join("\n");
  return doc.toString({ lineWidth: 0, singleQuote: true, flowCollectionPadding: false });
}

/** Comment text on one line: control characters (a line break would end the comment) become spaces. */
function commentText(text: string): string {
  return text.replace(/[\u0000-\u001f\u007f\u2028\u2029]/g, " ");
}
