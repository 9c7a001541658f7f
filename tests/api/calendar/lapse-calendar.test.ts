import { afterAll, beforeAll, describe, expect, it } from "vitest";
import ICAL from "ical.js";
import request from "supertest";
import { buildTestApp, sequelize, type TestApp } from "../../support/test-app.ts";
import { buildCompany } from "../../support/build-company.ts";
import {
  buildClearedProvider as buildCompanyCover,
  buildCredentialRow,
  buildProvider,
  trainingFields,
} from "../../fixtures/build-credential-row.ts";
import { signIn } from "../standing/sign-in-as.ts";

let t: TestApp;
beforeAll(() => {
  t = buildTestApp({ WARNING_DAYS: "30,7" });
});
afterAll(() => t.close());

interface ParsedEvent {
  uid: string;
  summary: string;
  description: string;
  start: string;
  allDay: boolean;
}

/** Parses the feed with ical.js, a parser independent of the generator, and fails on anything RFC 5545 rejects. */
function parseFeed(text: string): { calendar: ICAL.Component; events: ParsedEvent[] } {
  const calendar = new ICAL.Component(ICAL.parse(text));
  const events = calendar.getAllSubcomponents("vevent").map((c) => {
    const e = new ICAL.Event(c);
    return {
      uid: e.uid,
      summary: e.summary,
      description: e.description,
      start: e.startDate.toString(),
      allDay: e.startDate.isDate,
    };
  });
  return { calendar, events };
}

/** The company's cover plus an arc-flash card for its technician, which lapses by its retraining interval. */
async function buildClearedProvider(options: { glExpires: string; wcExpires: string }) {
  const p = await buildCompanyCover(options);
  await buildCredentialRow({
    typeCode: "arc_flash",
    companyId: p.company.id,
    technicianId: p.technician.id,
    submittedBy: p.admin.id,
    timeZone: p.company.timeZone,
    fields: trainingFields({ holderName: p.technician.name, issueDate: "2026-06-01" }),
  });
  return p;
}

const feedPath = (url: string) => new URL(url).pathname;

describe("lapse calendar", () => {
  it("serves the service company's coming lapses and warning dates as a calendar an independent parser reads back", async () => {
    const p = await buildClearedProvider({ glExpires: "2099-07-15", wcExpires: "2099-09-01" });
    const office = await signIn(t.app, p.admin.email);

    const created = await office.post("/api/calendar-feed");
    expect(created.status).toBe(201);
    const res = await request(t.app).get(feedPath(created.body.url));

    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toMatch(/^text\/calendar/); // RFC 5545 §8.1 media type
    // RFC 5545 §3.1: lines end in CRLF; §3.4: the stream is one VCALENDAR with VERSION 2.0 and PRODID (§3.7.3, §3.7.4).
    expect(res.text.startsWith("BEGIN:VCALENDAR\r\n")).toBe(true);
    const { calendar, events } = parseFeed(res.text);
    expect(calendar.getFirstPropertyValue("version")).toBe("2.0");
    expect(String(calendar.getFirstPropertyValue("prodid"))).toContain("Clearbench");

    const gl = events.filter((e) => e.summary.includes("Commercial general liability"));
    // One lapse event on the expiration date (all-day, RFC 5545 §3.6.1 with a DATE DTSTART), and one per warning day.
    expect(gl.map((e) => e.start).sort()).toEqual(["2099-06-15", "2099-07-08", "2099-07-15"]);
    expect(gl.every((e) => e.allDay)).toBe(true);
    const lapse = gl.find((e) => e.start === "2099-07-15")!;
    expect(lapse.summary).toBe(`Lapses: Commercial general liability, ${p.company.name}`);
    expect(lapse.description).toContain(`held by ${p.company.name}`);
    expect(lapse.description).toContain("/provider/documents");
    // RFC 5545 §3.8.4.7: UIDs are unique within the feed so a calendar updates an event instead of doubling it.
    expect(new Set(events.map((e) => e.uid)).size).toBe(events.length);
    const arcFlash = events.find(
      (e) => e.summary.startsWith("Lapses:") && e.description.includes(p.technician.name),
    );
    expect(arcFlash?.description).toContain(`/provider/technicians/${p.technician.id}`);
  });

  it("gives a shop its roster's lapses and nothing of a company it does not roster", async () => {
    const rostered = await buildClearedProvider({ glExpires: "2099-07-15", wcExpires: "2099-07-15" });
    const stranger = await buildClearedProvider({ glExpires: "2099-07-15", wcExpires: "2099-07-15" });
    const shop = await buildCompany("shop", ["buyer"]);
    await sequelize().query(
      "INSERT INTO roster_entries (shop_company_id, technician_id, added_by) VALUES ($1, $2, $3)",
      { bind: [shop.company.id, rostered.technician.id, shop.users.buyer!.id] },
    );

    const created = await (await signIn(t.app, shop.users.buyer!.email)).post("/api/calendar-feed");
    const { events } = parseFeed((await request(t.app).get(feedPath(created.body.url))).text);

    const text = events.map((e) => `${e.summary} ${e.description}`).join("\n");
    expect(text).toContain(rostered.technician.name);
    expect(text).toContain(rostered.company.name);
    expect(text).toContain(`/directory/technicians/${rostered.technician.id}`);
    expect(text).not.toContain(stranger.company.name);
    expect(text).not.toContain(stranger.technician.name);
  });

  it("stops answering the old address once the secret is rotated, and 404s a made-up one", async () => {
    const p = await buildProvider();
    const office = await signIn(t.app, p.admin.email);

    const first = await office.post("/api/calendar-feed");
    const second = await office.post("/api/calendar-feed");

    expect((await request(t.app).get(feedPath(first.body.url))).status).toBe(404);
    expect((await request(t.app).get(feedPath(second.body.url))).status).toBe(200);
    expect((await request(t.app).get(`/api/calendar/${"A".repeat(32)}.ics`)).status).toBe(404);
    expect((await office.get("/api/calendar-feed")).body).toMatchObject({ active: true });
    await office.delete("/api/calendar-feed").expect(200);
    expect((await request(t.app).get(feedPath(second.body.url))).status).toBe(404);
  });

  it("refuses the feed settings to a technician and to callers signed out", async () => {
    const p = await buildProvider();

    expect((await (await signIn(t.app, p.technicianUser.email)).post("/api/calendar-feed")).status).toBe(403);
    expect((await request(t.app).get("/api/calendar-feed")).status).toBe(401);
  });
});
