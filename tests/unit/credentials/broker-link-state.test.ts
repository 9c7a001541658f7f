import { describe, expect, it } from "vitest";
import { brokerLinkState } from "../../../shared/credentials/broker-schemas.ts";

const asOf = new Date("2027-03-01T15:00:00Z");

describe("a broker's upload link", () => {
  it("is sent while unused and before its expiry, and expired at its expiry instant (common practice)", () => {
    expect(brokerLinkState({ usedAt: null, expiresAt: new Date("2027-03-01T15:00:01Z") }, asOf)).toBe("sent");
    expect(brokerLinkState({ usedAt: null, expiresAt: asOf }, asOf)).toBe("expired");
  });

  it("is used once the certificate came, even when asked about after its expiry", () => {
    const usedAt = new Date("2027-02-20T10:00:00Z");

    expect(brokerLinkState({ usedAt, expiresAt: new Date("2027-02-25T00:00:00Z") }, asOf)).toBe("used");
  });
});
