import { describe, expect, it } from "vitest";
import { selfRatingSignals, type PartyContacts } from "../../../shared/reviews/self-rating.ts";

const none: PartyContacts = { emails: [], phones: [], addresses: [] };

describe("what a shop and a service company share", () => {
  it("takes one phone number however it is written", () => {
    const shop = { ...none, phones: ["+1 (312) 555-0148"] };
    const service = { ...none, phones: ["312.555.0148", null] };

    expect(selfRatingSignals(shop, service)).toEqual(["phone"]);
  });

  it("ignores a public mailbox provider and compares company domains without case", () => {
    const shop = { ...none, emails: ["buyer@Gmail.com", "parts@Harrow-Tool.test"] };
    const service = { ...none, emails: ["office@gmail.com", "desk@harrow-tool.test"] };

    expect(selfRatingSignals(shop, { ...service, emails: ["office@gmail.com"] })).toEqual([]);
    expect(selfRatingSignals(shop, service)).toEqual(["email_domain"]);
  });

  it("needs the street and the ZIP to match, not just the ZIP", () => {
    const shop = { ...none, addresses: [{ line: "12 Anvil Way", postalCode: "46204" }] };

    expect(
      selfRatingSignals(shop, { ...none, addresses: [{ line: "90 Forge Rd", postalCode: "46204" }] }),
    ).toEqual([]);
    expect(
      selfRatingSignals(shop, { ...none, addresses: [{ line: "12 ANVIL WAY.", postalCode: "46204-0001" }] }),
    ).toEqual(["address"]);
  });
});
