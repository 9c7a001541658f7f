import { describe, expect, it } from "vitest";
import { credentialTypeByCode } from "../../../shared/credentials/catalogue.ts";
import { onlyCompanyCanRenew } from "../../../shared/standing/who-renews.ts";

const codesHeldBy = (holder: string) =>
  [...credentialTypeByCode.values()].filter((t) => t.holder === holder).map((t) => t.code);

describe("who renews a requirement line", () => {
  it("sends a technician to the office for the company's workers' comp or its state exemption", () => {
    // Workers' compensation is bought by the employer, not the worker (common practice; state WC acts).
    expect(onlyCompanyCanRenew(["workers_comp", "workers_comp_exemption"])).toBe(true);
    expect(onlyCompanyCanRenew(["general_liability"])).toBe(true);
  });

  it("leaves a line the technician can meet with their own card to the technician", () => {
    const own = codesHeldBy("technician");
    expect(own.length).toBeGreaterThan(0);
    expect(onlyCompanyCanRenew(own.slice(0, 1))).toBe(false);
    expect(onlyCompanyCanRenew([...codesHeldBy("company").slice(0, 1), ...own.slice(0, 1)])).toBe(false);
  });

  it("never sends anyone away on an unknown or empty line", () => {
    expect(onlyCompanyCanRenew([])).toBe(false);
    expect(onlyCompanyCanRenew(undefined)).toBe(false);
    expect(onlyCompanyCanRenew(["no_such_type"])).toBe(false);
  });
});
