/**
 * The source text of each top-level member value of a JSON object, by key (the last one when a key
 * repeats, as JSON.parse keeps). Call it only on text JSON.parse accepted as an object: it walks the
 * text once, tracking strings and nesting, and trusts the syntax.
 */
export function memberSources(json: string): Map<string, string> {
  const out = new Map<string, string>();
  let i = json.indexOf("{") + 1;
  const skipSpace = () => {
    while (i < json.length && (json[i] === " " || json[i] === "\t" || json[i] === "\n" || json[i] === "\r")) i++;
  };
  const stringEnd = (from: number): number => {
    let j = from + 1;
    while (j < json.length && json[j] !== '"') j += json[j] === "\\" ? 2 : 1;
    return j + 1;
  };
  for (;;) {
    skipSpace();
    if (i >= json.length || json[i] === "}") break;
    const keyEnd = stringEnd(i);
    const key = JSON.parse(json.slice(i, keyEnd)) as string;
    i = keyEnd;
    skipSpace();
    i++; // the colon
    skipSpace();
    const start = i;
    let depth = 0;
    while (i < json.length) {
      const c = json[i];
      if (c === '"') {
        i = stringEnd(i);
        continue;
      }
      if (c === "{" || c === "[") depth++;
      else if (c === "}" || c === "]") {
        if (depth === 0) break;
        depth--;
      } else if (c === "," && depth === 0) break;
      i++;
    }
    out.set(key, json.slice(start, i).trim());
    if (json[i] === ",") i++;
  }
  return out;
}
