/**
 * `format` on a text column (SPEC §1.1): the JSON Schema string formats as ajv-formats implements them.
 * Outside check: for every example the check must agree with ajv itself (Ajv2020 + ajv-formats validating
 * `{type: "string", format}`), and where a standard settles the answer, with that standard too.
 */
import { Ajv2020 } from "ajv/dist/2020.js";
import addFormatsModule from "ajv-formats";
import { describe, expect, it } from "vitest";
import { TEXT_FORMATS } from "../../src/checks/format.js";
import { passes, specErrors } from "./helpers.js";

// ajv-formats ships CommonJS; its default export arrives wrapped or bare depending on the loader.
const addFormats = ((addFormatsModule as unknown as { default?: unknown }).default ?? addFormatsModule) as (a: Ajv2020) => Ajv2020;
const ajv = addFormats(new Ajv2020({ strict: true }));
const ajvSays = (format: string, text: string): boolean => ajv.validate({ type: "string", format }, text);

/** [text, valid?, source] */
type Example = readonly [string, boolean, string];

const EXAMPLES: Readonly<Record<string, readonly Example[]>> = {
  email: [
    // RFC 5321 §4.1.2: Mailbox = Local-part "@" ( Domain / address-literal ); Dot-string local parts.
    ["orders@example.org", true, "RFC 5321 §4.1.2 Mailbox"],
    ["trail.sales@example.co.uk", true, "RFC 5321 §4.1.2 Dot-string"],
    ["gear+returns@example.com", true, "RFC 5321 §4.1.2 atext includes +"],
    ["plainaddress", false, "RFC 5321 §4.1.2: no @"],
    ["@example.org", false, "RFC 5321 §4.1.2: empty Local-part"],
    ["orders@", false, "RFC 5321 §4.1.2: empty Domain"],
    ["orders@@example.org", false, "RFC 5321 §4.1.2: one @"],
    ["two words@example.org", false, "RFC 5321 §4.1.2: space outside a Quoted-string"],
    [".dot@example.org", false, "RFC 5321 §4.1.2 Dot-string cannot start with a dot"],
  ],
  uri: [
    // RFC 3986 §1.1.2 lists these example URIs.
    ["ftp://ftp.is.co.za/rfc/rfc1808.txt", true, "RFC 3986 §1.1.2"],
    ["http://www.ietf.org/rfc/rfc2396.txt", true, "RFC 3986 §1.1.2"],
    ["ldap://[2001:db8::7]/c=GB?objectClass?one", true, "RFC 3986 §1.1.2"],
    ["news:comp.infosystems.www.servers.unix", true, "RFC 3986 §1.1.2"],
    ["tel:+1-816-555-1212", true, "RFC 3986 §1.1.2"],
    ["telnet://192.0.2.16:80/", true, "RFC 3986 §1.1.2"],
    ["urn:oasis:names:specification:docbook:dtd:xml:4.1.2", true, "RFC 3986 §1.1.2"],
    ["//example.org/path", false, "RFC 3986 §3: a URI has a scheme (this is a relative reference, §4.2)"],
    ["1http://example.org/", false, "RFC 3986 §3.1: scheme starts with a letter"],
    ["http://example.org/a b", false, "RFC 3986 §2: space is not allowed"],
    ["relative/path", false, "RFC 3986 §4.2: relative reference, not a URI"],
  ],
  uuid: [
    ["f81d4fae-7dec-11d0-a765-00a0c91e6bf6", true, "RFC 4122 §3 example"],
    ["F81D4FAE-7DEC-11D0-A765-00A0C91E6BF6", true, "RFC 4122 §3: hex digits are case-insensitive on input"],
    ["00000000-0000-0000-0000-000000000000", true, "RFC 4122 §4.1.7 nil UUID"],
    ["f81d4fae7dec11d0a76500a0c91e6bf6", false, "RFC 4122 §3 string representation has hyphens"],
    ["f81d4fae-7dec-11d0-a765-00a0c91e6bf", false, "RFC 4122 §3: node is 12 hex digits"],
    ["g81d4fae-7dec-11d0-a765-00a0c91e6bf6", false, "RFC 4122 §3: hex digits only"],
    ["f81d4fae-7dec11d0-a765-00a0c91e6bf6", false, "RFC 4122 §3: 8-4-4-4-12 grouping"],
  ],
  ipv4: [
    // RFC 791 §2.3: a 32-bit address (from memory); the dotted text form is RFC 3986 §3.2.2 IPv4address/dec-octet.
    ["192.0.2.1", true, "RFC 3986 §3.2.2 dec-octet x4"],
    ["0.0.0.0", true, "RFC 3986 §3.2.2"],
    ["255.255.255.255", true, "RFC 3986 §3.2.2 dec-octet max 255"],
    ["256.1.1.1", false, "RFC 3986 §3.2.2 dec-octet max 255; RFC 791 8-bit octets"],
    ["192.0.2", false, "RFC 3986 §3.2.2 four octets"],
    ["192.0.2.1.5", false, "RFC 3986 §3.2.2 four octets"],
    ["192.0.2.01", false, "RFC 3986 §3.2.2 dec-octet has no leading zero"],
    ["192.0.2.-1", false, "RFC 3986 §3.2.2 digits only"],
  ],
  ipv6: [
    // RFC 4291 §2.2 text representations (also RFC 3986 §3.2.2 IPv6address).
    ["2001:DB8:0:0:8:800:200C:417A", true, "RFC 4291 §2.2 form 1"],
    ["2001:DB8::8:800:200C:417A", true, "RFC 4291 §2.2 form 2"],
    ["FF01::101", true, "RFC 4291 §2.2 form 2"],
    ["::1", true, "RFC 4291 §2.2 loopback"],
    ["::", true, "RFC 4291 §2.2 unspecified"],
    ["::FFFF:129.144.52.38", true, "RFC 4291 §2.2 form 3"],
    ["2001:db8::8::1", false, "RFC 4291 §2.2: '::' appears once"],
    ["1:2:3:4:5:6:7:8:9", false, "RFC 4291 §2.2: eight pieces"],
    ["12345::1", false, "RFC 4291 §2.2: at most four hex digits a piece"],
    ["gggg::1", false, "RFC 4291 §2.2: hex digits"],
  ],
  date: [
    // RFC 3339 §5.6 full-date, §5.7 day ranges and Appendix C leap years.
    ["1985-04-12", true, "RFC 3339 §5.8"],
    ["2024-02-29", true, "RFC 3339 §5.7 / Appendix C leap year"],
    ["2000-02-29", true, "RFC 3339 Appendix C: divisible by 400"],
    ["2023-02-29", false, "RFC 3339 §5.7: 28 days"],
    ["1900-02-29", false, "RFC 3339 Appendix C: century not divisible by 400"],
    ["2024-04-31", false, "RFC 3339 §5.7: April has 30 days"],
    ["2024-13-01", false, "RFC 3339 §5.6 date-month 01-12"],
    ["2024-1-01", false, "RFC 3339 §5.6 date-month is 2DIGIT"],
    ["20240101", false, "RFC 3339 §5.6 full-date has hyphens"],
  ],
  "date-time": [
    // RFC 3339 §5.8 examples.
    ["1985-04-12T23:20:50.52Z", true, "RFC 3339 §5.8"],
    ["1996-12-19T16:39:57-08:00", true, "RFC 3339 §5.8"],
    ["1990-12-31T23:59:60Z", true, "RFC 3339 §5.8 leap second"],
    ["1990-12-31T15:59:60-08:00", true, "RFC 3339 §5.8 leap second in Pacific time"],
    ["1937-01-01T12:00:27.87+00:20", true, "RFC 3339 §5.8"],
    ["1985-04-12T23:20:50", false, "RFC 3339 §5.6: time-offset is required"],
    ["1985-04-12T24:20:50Z", false, "RFC 3339 §5.6 time-hour 00-23"],
    ["1985-04-12T23:61:50Z", false, "RFC 3339 §5.6 time-minute 00-59"],
    ["1985-02-30T23:20:50Z", false, "RFC 3339 §5.7"],
    ["1985-04-12", false, "RFC 3339 §5.6: date-time needs a time"],
  ],
  hostname: [
    // RFC 1123 §2.1 and RFC 952 (from memory): letters, digits and hyphens; labels up to 63 characters.
    ["example.org", true, "RFC 1123 §2.1"],
    ["trail-gear.example", true, "RFC 952 hyphen inside a label"],
    ["3com.example", true, "RFC 1123 §2.1 may start with a digit"],
    ["-edge.example", false, "RFC 952: no leading hyphen"],
    ["edge-.example", false, "RFC 952: no trailing hyphen"],
    ["under_score.example", false, "RFC 952: no underscore"],
    [`${"a".repeat(64)}.example`, false, "RFC 1123 §2.1: label at most 63"],
    ["exa mple.org", false, "RFC 952: no space"],
  ],
};

describe("format agrees with ajv and the standards", () => {
  for (const [format, examples] of Object.entries(EXAMPLES)) {
    it.each(examples)(`${format}: %s -> %s (%s)`, (text, valid) => {
      const ours = passes("format", { type: "text", format }, text);
      expect(ours).toBe(ajvSays(format, text));
      expect(ours).toBe(valid);
    });
  }

  it("every listed format compiles and agrees with ajv on a sample of inputs", () => {
    const probes = ["", "x", "2024-06-15", "12:30:00Z", "P1D", "https://example.org/a?b#c", "/a/b", "0/a", "YWJj", "{x}", "[a-", "orders@example.org", "::1"];
    for (const format of TEXT_FORMATS) {
      for (const text of probes) {
        if (text === "") continue; // the engine never passes a blank cell to a check
        expect([format, text, passes("format", { type: "text", format }, text)]).toEqual([format, text, ajvSays(format, text)]);
      }
    }
  });
});

describe("format names", () => {
  it("an unknown name is a spec error at ['format'] that lists the known ones", () => {
    const errors = specErrors("format", { type: "text", format: "e-mail" });
    expect(errors).toHaveLength(1);
    expect(errors[0]?.path).toEqual(["format"]);
    for (const name of TEXT_FORMATS) expect(errors[0]?.message).toContain(name);
  });
  it("a list of formats (date-column style) on a text column is refused the same way", () => {
    const errors = specErrors("format", { type: "text", format: ["email"] });
    expect(errors.map((e) => e.path)).toEqual([["format"]]);
  });
  it("the listed formats are all ajv-formats formats", () => {
    for (const name of TEXT_FORMATS) expect([name, ajv.formats[name] !== undefined]).toEqual([name, true]);
  });
});
