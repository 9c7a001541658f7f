import { describe, expect, it } from "vitest";
import { loadConfig } from "../../../server/config.ts";
import { wroteRecently } from "../../../server/db/replica.ts";

describe("replica settings", () => {
  it("runs without a replica and keeps reads on the primary for 10 seconds after a write by default", () => {
    const config = loadConfig({});
    expect(config.DATABASE_REPLICA_URL).toBeUndefined();
    expect(config.READ_YOUR_WRITES_SECONDS).toBe(10);
  });

  it("accepts a postgres:// or postgresql:// replica address (libpq connection URI, PostgreSQL docs §34.1.1)", () => {
    expect(
      loadConfig({ DATABASE_REPLICA_URL: "postgres://reader@db-2:5432/clearbench" }).DATABASE_REPLICA_URL,
    ).toBe("postgres://reader@db-2:5432/clearbench");
    expect(loadConfig({ DATABASE_REPLICA_URL: "postgresql://db-2/clearbench" }).DATABASE_REPLICA_URL).toBe(
      "postgresql://db-2/clearbench",
    );
  });

  it("refuses another kind of address, naming the variable", () => {
    expect(() => loadConfig({ DATABASE_REPLICA_URL: "mysql://db-2/clearbench" })).toThrow(
      /DATABASE_REPLICA_URL/,
    );
    expect(() => loadConfig({ DATABASE_REPLICA_URL: "db-2:5432" })).toThrow(/DATABASE_REPLICA_URL/);
  });

  it("takes READ_YOUR_WRITES_SECONDS as whole seconds from 0 to an hour", () => {
    expect(loadConfig({ READ_YOUR_WRITES_SECONDS: "0" }).READ_YOUR_WRITES_SECONDS).toBe(0);
    expect(loadConfig({ READ_YOUR_WRITES_SECONDS: "3600" }).READ_YOUR_WRITES_SECONDS).toBe(3600);
    for (const bad of ["-1", "3601", "2.5", "soon"]) {
      expect(() => loadConfig({ READ_YOUR_WRITES_SECONDS: bad })).toThrow(/READ_YOUR_WRITES_SECONDS/);
    }
  });

  it("counts a session as having written only within the window (common practice: read-your-writes)", () => {
    const now = 1_000_000;
    expect(wroteRecently({ session: { wroteAt: now - 9_999 } }, 10, now)).toBe(true);
    expect(wroteRecently({ session: { wroteAt: now - 10_000 } }, 10, now)).toBe(false);
    expect(wroteRecently({ session: {} }, 10, now)).toBe(false);
    expect(wroteRecently({}, 10, now)).toBe(false);
    expect(wroteRecently({ session: { wroteAt: now } }, 0, now)).toBe(false);
  });
});
