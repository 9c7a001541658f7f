import { describe, expect, it } from "vitest";
import { credentialTypeByCode, credentialTypes } from "../../../shared/credentials/catalogue.ts";

describe("card descriptions", () => {
  it("never say that a card alone qualifies or authorizes someone", () => {
    const implying = credentialTypes.filter((t) =>
      /\bfor qualified persons\b|\bqualifies\b|\bcertifies\b|\(authorized employee\)|\bneeded to\b/i.test(
        t.description,
      ),
    );

    expect(implying.map((t) => t.code)).toEqual([]);
  });

  it("leave the qualified-person decision for electrical work to the employer", () => {
    // NFPA 70E (2024) 110.6 (section number from memory; 110.2 in earlier editions)
    expect(credentialTypeByCode.get("arc_flash")?.description).toMatch(/employer decides/);
  });

  it("defer to the host site's lockout/tagout procedure and forklift evaluation", () => {
    expect(credentialTypeByCode.get("lockout_tagout")?.description).toMatch(/29 CFR 1910\.147/);
    expect(credentialTypeByCode.get("powered_truck")?.description).toMatch(/29 CFR 1910\.178\(l\)/);
  });

  it("say that trade license requirements vary by state and town", () => {
    expect(credentialTypeByCode.get("trade_license")?.description).toMatch(/vary by state and town/);
  });

  it("offers machine rigging and moving as a technician's training card with its caution", () => {
    const rigging = credentialTypeByCode.get("machine_rigging");

    expect(rigging).toMatchObject({ holder: "technician", category: "safety", fieldSet: "training" });
    expect(rigging?.description).toMatch(/training only/);
    expect(rigging?.description).toMatch(/lift plan/);
  });
});
