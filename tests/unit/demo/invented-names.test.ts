import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { buildDemoWorld } from "../../../server/db/demo-scenario/build-demo-world.ts";
import { demoNaic, isDemoNaic } from "../../../server/db/demo-scenario/demo-naic.ts";
import { randomCertificateValues } from "../../../server/db/demo-scenario/documents/build-certificate-pdf.ts";

const root = path.resolve(import.meta.dirname, "../../..");

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    return statSync(full).isDirectory() ? files(full) : /\.tsx?$/.test(name) ? [full] : [];
  });
}

// Words reviewers recognized as a real builder's model line, a real router brand, real brand words and a real landmark.
const REAL_WORDS = /VMX-?\d|Axiom|Highmark|Redwing|Monument Circle/i;

describe("demo and bench data", () => {
  it("names no real model line, brand or landmark", () => {
    const sources = [
      ...files(path.join(root, "server/db/demo-scenario")),
      path.join(root, "jobs/bench/large-data-names.ts"),
      path.join(root, "jobs/bench/large-data-sql.ts"),
    ];

    const offenders = sources.filter((f) => REAL_WORDS.test(readFileSync(f, "utf8")));

    expect(offenders.map((f) => path.relative(root, f))).toEqual([]);
  });

  it("gives every demo insurer a NAIC code of the demo shape", () => {
    const world = buildDemoWorld(new Date("2026-12-02T15:00:00Z"));
    const codes = world.credentials
      .map((c) => (c.fields as { naic?: string }).naic)
      .filter((n): n is string => typeof n === "string");
    const generated = Array.from({ length: 50 }, (_, seed) =>
      randomCertificateValues(seed).insurers.map((i) => i.naic),
    ).flat();

    expect(codes.length).toBeGreaterThan(0);
    expect([...codes, ...generated].filter((n) => !isDemoNaic(n))).toEqual([]);
    expect(demoNaic(7)).toBe("00007");
  });

  it("makes bench NAIC codes of the same demo shape", () => {
    const sql = readFileSync(path.join(root, "jobs/bench/large-data-sql.ts"), "utf8");

    expect(sql).toMatch(/'naic', '000' \|\| lpad\(/);
  });
});
