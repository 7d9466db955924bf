/**
 * Compile a path glob to a RegExp over '/'-separated relative paths: `*` and `?` stay inside one
 * folder, `**` spans folders, `{a,b}` picks one; everything else is literal. Built from escaped
 * pieces with no nested quantifiers, so matching is linear.
 */
export function globToRegExp(glob: string): RegExp {
  let re = "";
  let inBraces = false;
  for (let i = 0; i < glob.length; i++) {
    const c = glob[i] as string;
    if (c === "*" && glob[i + 1] === "*") {
      const slash = glob[i + 2] === "/";
      re += slash ? "(?:[^/]*/)*" : ".*";
      i += slash ? 2 : 1;
    } else if (c === "*") re += "[^/]*";
    else if (c === "?") re += "[^/]";
    else if (c === "{") {
      re += "(?:";
      inBraces = true;
    } else if (c === "}" && inBraces) {
      re += ")";
      inBraces = false;
    } else if (c === "," && inBraces) re += "|";
    else re += c.replace(/[.+^$()|[\]\\]/g, "\\$&");
  }
  return new RegExp(`^${re}$`);
}
