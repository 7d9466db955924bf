/** Edit distance for typo suggestions: a swap of two neighbouring characters is one edit. */
import { describe, expect, it } from "vitest";
import { editDistance, nearMiss } from "../../src/contract/near-miss.js";

describe("editDistance", () => {
  // Wikipedia, "Levenshtein distance": kitten → sitting takes 3 edits.
  it("counts insertions, deletions and substitutions", () => {
    expect(editDistance("kitten", "sitting")).toBe(3);
    expect(editDistance("", "abc")).toBe(3);
    expect(editDistance("same", "same")).toBe(0);
  });

  // Wikipedia, "Damerau–Levenshtein distance": under optimal string alignment CA → ABC is 3 (no substring
  // is edited twice), while a plain swap such as "flase" → "false" is 1.
  it("counts a swap of neighbours as one edit, optimal-string-alignment style", () => {
    expect(editDistance("flase", "false")).toBe(1);
    expect(editDistance("ab", "ba")).toBe(1);
    expect(editDistance("CA", "ABC")).toBe(3);
  });

  it("makes a swapped key a near miss of the right one", () => {
    expect(nearMiss("flase", ["true", "false"])).toBe("false");
    expect(nearMiss("no", ["true", "false"])).toBeUndefined();
  });
});
