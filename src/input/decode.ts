import { isAscii } from "node:buffer";
import type { Encoding } from "./types.js";
import { createUtf8Checker, type Utf8Checker } from "./utf8.js";

/** UTF-8 bytes ready for the parser; when `invalid` is set, `data` is the valid part before the bad bytes and reading must stop. */
export interface Decoded {
  readonly data: Buffer;
  readonly invalid?: string;
}

/** Turns raw chunks in one encoding into UTF-8 chunks, stopping at the first byte invalid in that encoding. */
export interface Decoder {
  decode(chunk: Buffer): Decoded;
  end(): Decoded;
  /** The encoding in use; for `auto`, what it resolved to so far. */
  encoding(): string;
  /** Why `auto` chose windows-1252, when it did. */
  note(): string | undefined;
}

interface Body {
  decode(chunk: Buffer): Decoded;
  end(): Decoded;
}

const EMPTY = Buffer.alloc(0);
const NOTHING: Decoded = { data: EMPTY };
const BOM_UTF8 = [0xef, 0xbb, 0xbf] as const;
const AUTO_NOTE = "no byte order mark and bytes that are not UTF-8: read as windows-1252";

/** A decoder for the declared encoding; a byte order mark of that encoding is dropped. */
export function createDecoder(declared: Encoding): Decoder {
  let body: Body | undefined;
  let resolved: string = declared === "auto" ? "utf-8" : declared;
  let note: string | undefined;
  let head: Buffer | undefined;

  // The byte order mark is up to 3 bytes: hold the first bytes back until there are enough to tell.
  const choose = (start: Buffer): Buffer => {
    const bom = sniffBom(start);
    if (declared === "auto") {
      if (bom !== undefined) resolved = bom.encoding;
      body =
        bom === undefined
          ? autoBody(() => {
              resolved = "windows-1252";
              note = AUTO_NOTE;
            })
          : unicodeBody(bom.encoding);
      return bom === undefined ? start : start.subarray(bom.length);
    }
    body = declared === "windows-1252" || declared === "latin1" ? singleByteBody(declared) : unicodeBody(declared);
    return bom !== undefined && bom.encoding === declared ? start.subarray(bom.length) : start;
  };

  return {
    decode(chunk) {
      if (body !== undefined) return body.decode(chunk);
      head = head === undefined ? chunk : Buffer.concat([head, chunk]);
      if (head.length < 3) return NOTHING;
      const start = choose(head);
      head = undefined;
      return body!.decode(start);
    },
    end() {
      if (body === undefined) {
        const start = choose(head ?? EMPTY);
        head = undefined;
        const last = body!.decode(start);
        if (last.invalid !== undefined) return last;
        const tail = body!.end();
        const data = tail.data.length === 0 ? last.data : Buffer.concat([last.data, tail.data]);
        return tail.invalid === undefined ? { data } : { data, invalid: tail.invalid };
      }
      return body.end();
    },
    encoding: () => resolved,
    note: () => note,
  };
}

function sniffBom(b: Buffer): { encoding: "utf-8" | "utf-16le" | "utf-16be"; length: number } | undefined {
  if (b[0] === BOM_UTF8[0] && b[1] === BOM_UTF8[1] && b[2] === BOM_UTF8[2]) return { encoding: "utf-8", length: 3 };
  if (b[0] === 0xff && b[1] === 0xfe) return { encoding: "utf-16le", length: 2 };
  if (b[0] === 0xfe && b[1] === 0xff) return { encoding: "utf-16be", length: 2 };
  return undefined;
}

function unicodeBody(encoding: "utf-8" | "utf-16le" | "utf-16be"): Body {
  return encoding === "utf-8" ? utf8Body(createUtf8Checker()) : utf16Body(encoding === "utf-16be");
}

/** UTF-8 passes through untouched: only validated, so the parser gets the very buffers read from disk. */
function utf8Body(checker: Utf8Checker): Body {
  return {
    decode(chunk) {
      const bad = checker.check(chunk);
      return bad < 0 ? { data: chunk } : { data: chunk.subarray(0, bad), invalid: "bytes that are not valid UTF-8" };
    },
    end: () => (checker.complete() ? NOTHING : { data: EMPTY, invalid: "the file ends inside a UTF-8 character" }),
  };
}

/**
 * Code points of bytes 0x80-0x9F in windows-1252, from the WHATWG Encoding Standard's index-windows-1252
 * (the five bytes Microsoft leaves undefined map to the C1 control of the same number). Node 20's
 * TextDecoder("windows-1252") decodes these bytes as ISO-8859-1 (0x80 gives U+0080), hence our own table.
 */
const CP1252_HIGH = String.fromCharCode(
  0x20ac, 0x81, 0x201a, 0x192, 0x201e, 0x2026, 0x2020, 0x2021, 0x2c6, 0x2030, 0x160, 0x2039, 0x152, 0x8d, 0x17d, 0x8f,
  0x90, 0x2018, 0x2019, 0x201c, 0x201d, 0x2022, 0x2013, 0x2014, 0x2dc, 0x2122, 0x161, 0x203a, 0x153, 0x9d, 0x17e, 0x178,
);
const C1 = /[\x80-\x9f]/g;
const toCp1252 = (c: string): string => CP1252_HIGH.charAt(c.charCodeAt(0) - 0x80);

/**
 * windows-1252 (0x80 is the euro sign); latin1 as ISO-8859-1 proper, where every byte is the code point
 * of the same number (the WHATWG standard would read the label `latin1` as windows-1252).
 */
function singleByteBody(encoding: "windows-1252" | "latin1"): Body {
  return {
    decode(chunk) {
      if (isAscii(chunk)) return { data: chunk };
      let text = chunk.toString("latin1");
      if (encoding === "windows-1252") text = text.replace(C1, toCp1252);
      return { data: Buffer.from(text, "utf8") };
    },
    end: () => NOTHING,
  };
}

const SURROGATE = /[\uD800-\uDFFF]/;

/** UTF-16 in either byte order; an odd byte or an unpaired surrogate is invalid. */
function utf16Body(bigEndian: boolean): Body {
  let odd: Buffer | undefined;
  let high = "";
  return {
    decode(chunk) {
      const buf = odd === undefined ? chunk : Buffer.concat([odd, chunk]);
      const even = buf.length - (buf.length & 1);
      odd = even < buf.length ? Buffer.from(buf.subarray(even)) : undefined;
      let units = buf.subarray(0, even);
      if (bigEndian) units = Buffer.from(units).swap16();
      let text = high + units.toString("utf16le");
      high = "";
      const last = text.charCodeAt(text.length - 1);
      if (last >= 0xd800 && last <= 0xdbff) {
        high = text.slice(-1);
        text = text.slice(0, -1);
      }
      if (SURROGATE.test(text)) {
        const bad = loneSurrogate(text);
        if (bad >= 0) return { data: Buffer.from(text.slice(0, bad), "utf8"), invalid: "an unpaired UTF-16 surrogate" };
      }
      return { data: Buffer.from(text, "utf8") };
    },
    end: () => (odd === undefined && high === "" ? NOTHING : { data: EMPTY, invalid: "the file ends inside a UTF-16 character" }),
  };
}

function loneSurrogate(text: string): number {
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 0xd800 || c > 0xdfff) continue;
    const next = text.charCodeAt(i + 1);
    if (c <= 0xdbff && next >= 0xdc00 && next <= 0xdfff) {
      i++;
      continue;
    }
    return i;
  }
  return -1;
}

/**
 * `auto` without a byte order mark: pure ASCII reads the same either way, so the choice waits for the
 * first non-ASCII byte. Valid UTF-8 there means UTF-8 from then on (later invalid bytes stop reading);
 * invalid UTF-8 before any other non-ASCII text means windows-1252 for the whole file.
 */
function autoBody(fallBack: () => void): Body {
  let chosen: Body | undefined;
  let pending: Buffer | undefined;
  return {
    decode(input) {
      if (chosen !== undefined) return chosen.decode(input);
      const chunk = pending === undefined ? input : Buffer.concat([pending, input]);
      pending = undefined;
      if (isAscii(chunk)) return { data: chunk };
      const checker = createUtf8Checker();
      const bad = checker.check(chunk);
      if (bad < 0) {
        if (checker.complete() || !isAscii(chunk.subarray(0, lastLead(chunk)))) {
          chosen = utf8Body(checker);
          return { data: chunk };
        }
        // Only a split character at the very end is non-ASCII: decide once it is whole.
        const cut = lastLead(chunk);
        pending = Buffer.from(chunk.subarray(cut));
        return { data: chunk.subarray(0, cut) };
      }
      if (isAscii(chunk.subarray(0, bad))) {
        fallBack();
        chosen = singleByteBody("windows-1252");
        return chosen.decode(chunk);
      }
      chosen = utf8Body(checker);
      return { data: chunk.subarray(0, bad), invalid: "bytes that are not valid UTF-8 (earlier text was UTF-8)" };
    },
    end() {
      if (chosen !== undefined) return chosen.end();
      if (pending === undefined) return NOTHING;
      fallBack();
      chosen = singleByteBody("windows-1252");
      return chosen.decode(pending);
    },
  };
}

/** Offset of the last byte that is not a UTF-8 continuation byte. */
function lastLead(chunk: Buffer): number {
  let p = chunk.length - 1;
  while (p > 0 && ((chunk[p] ?? 0) & 0xc0) === 0x80) p--;
  return p;
}
