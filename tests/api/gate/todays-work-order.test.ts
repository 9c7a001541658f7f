import { describe, expect, it } from "vitest";
import request from "supertest";
import { useTestApp } from "../../support/test-app.ts";
import { buildCompany } from "../../support/build-company.ts";
import { buildClearedProvider } from "../../fixtures/build-credential-row.ts";
import { Site } from "../../../server/sites/model.ts";
import { WorkOrder } from "../../../server/work-orders/model.ts";
import { signIn } from "../standing/sign-in-as.ts";

const t = useTestApp();

const pathOf = (url: string) => {
  const u = new URL(url);
  return `/api${u.pathname}${u.search}`;
};

// The date on a wall calendar in a zone, by the IANA time zone database (from memory: en-CA prints YYYY-MM-DD).
const dateIn = (timeZone: string, offsetDays = 0) =>
  new Date(Date.now() + offsetDays * 86_400_000).toLocaleDateString("en-CA", { timeZone });

async function scene(timeZone: string) {
  const p = await buildClearedProvider({ glExpires: "2099-07-15", wcExpires: "2099-07-15" });
  const shop = await buildCompany("shop", ["buyer"]);
  const site = await Site.create({
    companyId: shop.company.id,
    name: "East gate",
    addressLine: "300 Sample Way",
    postalCode: "60601",
    timeZone,
    latitude: 41.8858,
    longitude: -87.6181,
  });
  const order = (preferredDates: string[], status: "accepted" | "requested" = "accepted") =>
    WorkOrder.create({
      shopCompanyId: shop.company.id,
      siteId: site.id,
      equipmentId: null,
      technicianId: p.technician.id,
      serviceCompanyId: p.company.id,
      requirementSetId: null,
      technology: "lathe",
      problem: "Spindle alarm on start-up",
      urgency: "normal",
      preferredDates,
      status,
      createdBy: shop.users.buyer!.id,
      acceptedAt: status === "accepted" ? new Date() : null,
    });
  const check = async () => {
    const sign = await (await signIn(t.app, shop.users.buyer!.email)).get(`/api/sites/${site.id}/gate-sign`);
    const badge = await (
      await signIn(t.app, p.technicianUser.email)
    )
      .get("/api/badge")
      .query({ site: sign.body.code });
    const res = await request(t.app).get(pathOf(badge.body.url));
    expect(res.status).toBe(200);
    return res.body.workOrder as { id: number; technology: string } | null;
  };
  return { order, check };
}

describe("the work order the front desk is told to expect", () => {
  it("is an accepted order dated today at the site, not one for another day", async () => {
    const s = await scene("America/Chicago");
    await s.order([dateIn("America/Chicago", -1)]);
    await s.order([dateIn("America/Chicago", 2)]);
    expect(await s.check()).toBeNull();

    const today = await s.order([dateIn("America/Chicago", 2), dateIn("America/Chicago")]);
    expect(await s.check()).toEqual({ id: today.id, technology: "lathe" });
  });

  it("is not a requested order nobody accepted, nor an accepted one without dates", async () => {
    const s = await scene("America/Chicago");
    await s.order([dateIn("America/Chicago")], "requested");
    await s.order([]);
    expect(await s.check()).toBeNull();
  });

  it("takes today in the site's zone, not the server's", async () => {
    // UTC+14 and UTC-11 are 25 hours apart, so their calendar dates always differ (IANA tz database).
    const s = await scene("Pacific/Kiritimati");
    await s.order([dateIn("Pacific/Pago_Pago")]);
    expect(await s.check()).toBeNull();

    const today = await s.order([dateIn("Pacific/Kiritimati")]);
    expect(await s.check()).toEqual({ id: today.id, technology: "lathe" });
  });
});
