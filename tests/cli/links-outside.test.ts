/**
 * Deliveries and contracts can come from an untrusted pull request, and a pull request can add a
 * symbolic link. A path inside the repository that leads outside it is refused (exit 2, one line),
 * so a report never prints the lines of a file outside the repository.
 */
import { existsSync, lstatSync, mkdirSync, readFileSync, symlinkSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { tablegate } from "../registry/helpers.js";
import { tempDir } from "../helpers/temp-dir.js";

const CONTRACT = "tablegate: 1\nname: orders\ncolumns:\n  id: { type: integer }\n";

/** A repository folder, and beside it (outside) a secret file shaped like a delivery. */
function setUp(): { root: string; secret: string } {
  const base = tempDir("tablegate-links-");
  const root = join(base, "repo");
  mkdirSync(join(root, ".git"), { recursive: true });
  mkdirSync(join(root, "data"));
  mkdirSync(join(root, "contracts"));
  writeFileSync(join(root, "contracts", "orders.contract.yaml"), CONTRACT);
  const secret = join(base, "secret.csv");
  writeFileSync(secret, "id\nTOP-SECRET-VALUE\n");
  return { root, secret };
}

describe("links out of the repository", () => {
  it("a delivery that links outside is refused and nothing of it is printed", async () => {
    const { root, secret } = setUp();
    symlinkSync(secret, join(root, "data", "w49.csv"));
    const r = await tablegate(root, "check", "data/w49.csv", "--contract", "contracts/orders.contract.yaml", "--report", "json=-");
    expect(r.code).toBe(2);
    expect(r.err.trim().split("\n")).toHaveLength(1);
    expect(r.err).toContain("data/w49.csv");
    expect(r.out + r.err).not.toContain("TOP-SECRET-VALUE");
  });

  it("a contract that links outside is refused", async () => {
    const { root, secret } = setUp();
    writeFileSync(join(root, "data", "w49.csv"), "id\n1\n");
    symlinkSync(secret, join(root, "contracts", "linked.contract.yaml"));
    const r = await tablegate(root, "check", "data/w49.csv", "--contract", "contracts/linked.contract.yaml");
    expect(r.code).toBe(2);
    expect(r.err).toContain("contracts/linked.contract.yaml");
    expect(r.err).not.toContain("TOP-SECRET-VALUE");
  });

  it("tablegate.yaml may not route to a contract above the root", async () => {
    const { root } = setUp();
    writeFileSync(join(root, "tablegate.yaml"), "tablegate: 1\ndeliveries:\n  - files: data/*.csv\n    contract: ../secret.csv\n");
    writeFileSync(join(root, "data", "w49.csv"), "id\n1\n");
    const r = await tablegate(root, "check");
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/^tablegate: tablegate\.yaml:4:15: /);
  });

  it("the same delivery as a plain file inside is checked (the refusal is about the link)", async () => {
    const { root } = setUp();
    writeFileSync(join(root, "data", "w49.csv"), "id\nx\n");
    const r = await tablegate(root, "check", "data/w49.csv", "--contract", "contracts/orders.contract.yaml", "--report", "json=-");
    expect(r.code).toBe(1);
  });
});

describe("infer and links", () => {
  it("infer refuses a delivery that links outside, printing none of it", async () => {
    const { root, secret } = setUp();
    symlinkSync(secret, join(root, "data", "w49.csv"));
    const r = await tablegate(root, "infer", "data/w49.csv");
    expect(r.code).toBe(2);
    expect(r.out + r.err).not.toContain("TOP-SECRET-VALUE");
  });
});

describe("reports and links", () => {
  it("a report path that is a link is replaced by the report, and the file it pointed to is untouched", async () => {
    const { root, secret } = setUp();
    writeFileSync(join(root, "data", "w49.csv"), "id\n1\n");
    symlinkSync(secret, join(root, "report.json"));
    const r = await tablegate(root, "check", "data/w49.csv", "--contract", "contracts/orders.contract.yaml", "--report", "json=report.json");
    expect(r.code).toBe(0);
    expect(readFileSync(secret, "utf8")).toBe("id\nTOP-SECRET-VALUE\n");
    expect(lstatSync(join(root, "report.json")).isSymbolicLink()).toBe(false);
    expect(JSON.parse(readFileSync(join(root, "report.json"), "utf8"))).toMatchObject({ verdict: "pass" });
  });
});

describe("project files and links", () => {
  it("tablegate.yaml, the registry manifest and the lock are not read through links out of the repository", async () => {
    for (const target of ["tablegate.yaml", "reference/registry.yaml", "reference/registry.lock.json"]) {
      const { root } = setUp();
      const base = join(root, "..");
      mkdirSync(join(root, "reference"), { recursive: true });
      writeFileSync(join(base, "outside.yaml"), "SECRET-KEY-NAME: 1\n");
      symlinkSync(join(base, "outside.yaml"), join(root, target));
      writeFileSync(join(root, "data", "w49.csv"), "id\n1\n");
      const r = await tablegate(root, "check", "data/w49.csv", "--contract", "contracts/orders.contract.yaml");
      expect([target, r.code]).toEqual([target, 2]);
      expect(r.out + r.err).not.toContain("SECRET-KEY-NAME");
    }
  });

  it("ref lock does not write into a reference folder that links outside", async () => {
    const { root } = setUp();
    const base = join(root, "..");
    mkdirSync(join(base, "elsewhere"));
    writeFileSync(join(base, "elsewhere", "registry.yaml"), "tables: {}\n");
    symlinkSync(join(base, "elsewhere"), join(root, "reference"));
    const r = await tablegate(root, "ref", "lock");
    expect(r.code).toBe(2);
    expect(existsSync(join(base, "elsewhere", "registry.lock.json"))).toBe(false);
  });
});
