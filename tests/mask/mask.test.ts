import { describe, expect, it } from "vitest";
import { mask } from "../../src/report/mask.js";

// Masking rules are this project's own (SPEC §1.1 `sensitive`, example `j***@***.org`); showing only
// the last four digits of a card number is common practice, no source.

describe("mask: e-mail", () => {
  it.each([
    ["jane.doe@example.org", "j***@***.org"],
    ["Trail.Orders@summit-outfitters.co.uk", "T***@***.uk"],
    ["abcd@x.com", "a***@***.com"],
    // local part shorter than 4: no first character
    ["al@x.org", "***@***.org"],
    ["a@b.co", "***@***.co"],
    // a top-level domain that is not 2 to 6 letters is hidden too
    ["ranger@depot.internalnetwork", "r***@***.***"],
    ["ranger@10.0.0.1", "r***@***.***"],
  ])("%s → %s", (input, expected) => {
    expect(mask(input)).toBe(expected);
  });

  it("treats malformed addresses as text", () => {
    expect(mask("a@@b.org")).toBe("a*******");
    expect(mask("jane doe@x.org")).toBe("j*** *********");
    expect(mask("@example.org")).toBe("@***********");
    expect(mask("jane@localhost")).toBe("j*************");
  });
});

describe("mask: digits with separators", () => {
  it.each([
    ["123-45-6789", "***-**-6789"],
    ["4111 1111 1111 1111", "**** **** **** 1111"],
    ["(555) 010-4477", "(***) ***-4477"],
    ["+1 555 010 4477", "+* *** *** 4477"],
    ["987654321", "*****4321"],
    // 8 digits: a date or short number, masked whole
    ["2024-01-31", "****-**-**"],
    ["12345678", "********"],
    // a trailing run shorter than 4 (decimal fraction): masked whole
    ["1234567.89", "*******.**"],
    ["-1,234,567", "-*,***,***"],
    ["42", "**"],
    ["7", "*"],
  ])("%s → %s", (input, expected) => {
    expect(mask(input)).toBe(expected);
  });

  it("treats over-long digit strings as text", () => {
    const long = "1".repeat(41);
    expect(mask(long)).toBe("1" + "*".repeat(40));
  });
});

describe("mask: other text", () => {
  it.each([
    ["Al", "**"],
    ["Bea", "***"],
    ["Rhea", "R***"],
    ["Alexander", "A********"],
    ["Jane Q. Doe", "J*** ** ***"],
    ["  Dale ", "  D*** "],
    ["Flat 4B", "F*** **"],
    ["Zoë", "***"],
    ["Øyvind Å", "Ø***** *"],
  ])("%j → %j", (input, expected) => {
    expect(mask(input)).toBe(expected);
  });

  it("keeps the length in code points, so astral characters count once", () => {
    expect(mask("𝒜𝒷𝒸")).toBe("***");
    expect(mask("𝒜𝒷𝒸𝒹𝑒")).toBe("𝒜****");
  });

  it("caps long values at 64 code points and says how many were left out", () => {
    const out = mask("x".repeat(100));
    expect(out).toBe("x" + "*".repeat(63) + "…(+36)");
  });
});

describe("mask: never the raw value", () => {
  it("keeps the empty string empty", () => {
    expect(mask("")).toBe("");
  });

  it.each([["****"], ["*"], ["   "], ["\t"], ["j***@***.org"], ["***@***.org"], ["* *"]])(
    "changes already-masked-looking %j",
    (input) => {
      const out = mask(input);
      expect(out).not.toBe(input);
      expect(Array.from(out).length).toBe(Array.from(input).length);
    },
  );

  const alphabet = Array.from("aZ09*#@. -()+,_ëØ🏔\t");
  let seed = 2026;
  const rand = (n: number): number => {
    seed = (seed * 1103515245 + 12345) % 2147483648;
    return seed % n;
  };
  const generated: string[] = [];
  for (let i = 0; i < 5000; i++) {
    const len = 1 + rand(14);
    let s = "";
    for (let j = 0; j < len; j++) s += alphabet[rand(alphabet.length)];
    generated.push(s);
  }

  it("never returns a non-empty generated value unchanged, and is deterministic", () => {
    for (const s of generated) {
      const out = mask(s);
      expect(out, s).not.toBe(s);
      expect(mask(s)).toBe(out);
    }
  });

  it("never contains a generated value of 2+ letters or digits", () => {
    for (const s of generated) {
      if ((s.match(/[A-Za-z0-9ëØ]/g) ?? []).length < 2) continue;
      expect(mask(s).includes(s), s).toBe(false);
    }
  });

  it("shows at most a quarter of a word's letters", () => {
    const letters = Array.from("abcdefghijklmnopqrstuvwxyzÀÉÖ");
    for (let i = 0; i < 2000; i++) {
      const len = 1 + rand(30);
      let s = "";
      for (let j = 0; j < len; j++) s += letters[rand(letters.length)];
      const shown = Array.from(mask(s)).filter((ch) => ch !== "*").length;
      expect(shown, s).toBeLessThanOrEqual(Math.floor(len / 4));
    }
  });

  it("shows at most 4 digits of a card-like number, and only the last 4", () => {
    for (let i = 0; i < 1000; i++) {
      // 3 to 5 groups of 4: 12 to 20 digits
      const groups = Array.from({ length: 3 + rand(3) }, () => String(1000 + rand(9000)));
      const s = groups.join(i % 2 === 0 ? " " : "-");
      const out = mask(s);
      expect(out.slice(0, -4)).not.toMatch(/[0-9]/);
      expect(out.slice(-4)).toBe(s.slice(-4));
    }
  });
});
