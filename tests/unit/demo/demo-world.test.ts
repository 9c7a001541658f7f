import { describe, expect, it } from "vitest";
import { credentialTypeByCode } from "../../../shared/credentials/catalogue.ts";
import { fieldSetSchemas, type CredentialFields } from "../../../shared/credentials/credential-fields.ts";
import { credentialStates } from "../../../shared/credentials/schemas.ts";
import { greatCircleDistanceKm } from "../../../shared/geo/great-circle-distance.ts";
import { credentialLapseInstant, credentialStartInstant } from "../../../shared/standing/lapse-instant.ts";
import { machineTechnologies } from "../../../shared/technicians/schemas.ts";
import { lookupPostalCode } from "../../../server/geo/postal-codes.ts";
import { buildDemoWorld } from "../../../server/db/demo-scenario/build-demo-world.ts";
import type { DemoCredential, DemoWorld } from "../../../server/db/demo-scenario/demo-world-types.ts";
import { expectedInsuranceFields } from "../../../server/db/demo-scenario/documents/build-certificate-pdf.ts";

const DAY_MS = 86_400_000;
// A normal day, a month end (month arithmetic clamps) and a leap day.
const TODAYS = [
  new Date("2026-12-02T15:00:00Z"),
  new Date("2027-03-31T18:00:00Z"),
  new Date("2028-02-29T12:00:00Z"),
];

function zoneOf(world: DemoWorld, credential: DemoCredential): string {
  const company = world.companies.find((c) => c.key === credential.companyKey);
  if (!company) throw new Error(`no company ${credential.companyKey}`);
  return company.timeZone;
}

function lapseOf(world: DemoWorld, credential: DemoCredential): Date | null {
  const type = credentialTypeByCode.get(credential.typeCode);
  if (!type) throw new Error(`unknown type ${credential.typeCode}`);
  return credentialLapseInstant(type, credential.fields as CredentialFields, zoneOf(world, credential));
}

function find(world: DemoWorld, key: string): DemoCredential {
  const credential = world.credentials.find((c) => c.key === key);
  if (!credential) throw new Error(`no demo credential ${key}`);
  return credential;
}

const daysFrom = (today: Date, instant: Date) => (instant.getTime() - today.getTime()) / DAY_MS;

describe.each(TODAYS)("demo world as of %s", (today) => {
  const world = buildDemoWorld(today);

  it("gives every credential fields that pass its type's field schema", () => {
    const failures = world.credentials.flatMap((credential) => {
      const type = credentialTypeByCode.get(credential.typeCode);
      const parsed = type ? fieldSetSchemas[type.fieldSet].safeParse(credential.fields) : undefined;
      return parsed?.success ? [] : [credential.key];
    });

    expect(failures).toEqual([]);
  });

  it("holds credentials in every state", () => {
    const states = new Set(world.credentials.map((c) => c.state));

    expect([...states].sort()).toEqual([...credentialStates].sort());
  });

  it("keeps every verified credential in force today, and every lapsed one past its lapse", () => {
    const verifiedPast = world.credentials.filter(
      (c) => c.state === "verified" && (lapseOf(world, c)?.getTime() ?? Infinity) <= today.getTime(),
    );
    const lapsedInForce = world.credentials.filter(
      (c) => c.state === "lapsed" && (lapseOf(world, c)?.getTime() ?? Infinity) > today.getTime(),
    );

    expect(verifiedPast.map((c) => c.key)).toEqual([]);
    expect(lapsedInForce.map((c) => c.key)).toEqual([]);
  });

  it("lets Bluewater's general liability end within three weeks, so it shows as lapsing", () => {
    const lapse = lapseOf(world, find(world, "bluewater-gl"));

    expect(find(world, "bluewater-gl").state).toBe("verified");
    expect(daysFrom(today, lapse!)).toBeGreaterThan(10);
    expect(daysFrom(today, lapse!)).toBeLessThan(21);
  });

  it("lapses Copperline's general liability recently and queues its renewal from the same day", () => {
    const lapsed = find(world, "copperline-gl-lapsed");
    const renewal = find(world, "copperline-gl-renewal");
    const type = credentialTypeByCode.get("general_liability")!;

    expect(lapsed.state).toBe("lapsed");
    expect(daysFrom(today, lapseOf(world, lapsed)!)).toBeGreaterThan(-30);
    expect(renewal.state).toBe("submitted");
    // Continuous cover: the renewal starts at the instant the old policy ends (12:01 a.m. standard time, ISO CG DS 01 wording, from memory).
    expect(credentialStartInstant(type, renewal.fields as CredentialFields, zoneOf(world, renewal))).toEqual(
      lapseOf(world, lapsed),
    );
  });

  it("supersedes an older card only with a newer verified card of the same type and holder", () => {
    const superseded = world.credentials.filter((c) => c.state === "superseded");

    expect(superseded.length).toBeGreaterThan(0);
    for (const old of superseded) {
      const newer = find(world, old.supersededBy!);
      expect([newer.state, newer.typeCode, newer.technicianKey]).toEqual([
        "verified",
        old.typeCode,
        old.technicianKey,
      ]);
      expect(String(newer.fields.issueDate) > String(old.fields.issueDate)).toBe(true);
    }
  });

  it("gives a returned credential a reason and no other state one", () => {
    const withReason = world.credentials.filter((c) => c.returnReason !== null);

    expect(withReason.map((c) => c.state)).toEqual(["returned"]);
    expect(withReason[0]!.returnReason!.length).toBeGreaterThanOrEqual(5);
  });

  it("dates every submission and decision before today, decisions after their submission", () => {
    const wrong = world.credentials.filter(
      (c) =>
        c.submittedAt.getTime() >= today.getTime() ||
        (c.state === "submitted") !== (c.decidedAt === null) ||
        (c.decidedAt !== null && c.decidedAt.getTime() <= c.submittedAt.getTime()),
    );

    expect(wrong.map((c) => c.key)).toEqual([]);
  });

  it("has each credential submitted by a user of the holder's own company", () => {
    const strangers = world.credentials.filter((c) => {
      const company = world.companies.find((co) => co.key === c.companyKey);
      return !company?.users.some((u) => u.email === c.submittedBy);
    });

    expect(strangers.map((c) => c.key)).toEqual([]);
  });

  it("prints on each certificate exactly the fields its credential claims", () => {
    const certificates = world.credentials.filter((c) => c.document.kind === "certificate");

    for (const credential of certificates) {
      if (credential.document.kind !== "certificate") continue;
      const printed = expectedInsuranceFields(credential.document.values, credential.document.coverage);
      const { limits, ...rest } = credential.fields as Record<string, unknown> & {
        limits: Record<string, number>;
      };
      const claimed = {
        ...rest,
        ...Object.fromEntries(Object.entries(limits).map(([k, v]) => [`limits.${k}`, v])),
      };
      expect(claimed).toEqual(printed);
    }
  });

  it("prints on each card the holder, dates and builder its credential claims", () => {
    for (const credential of world.credentials) {
      if (credential.document.kind !== "card") continue;
      const card = credential.document.values;
      const printed = {
        holderName: card.holderName,
        issueDate: card.issueDate,
        expiryDate: card.expiryDate,
        ...card.oem,
      };
      const f = credential.fields;
      const claimed = {
        holderName: f.holderName,
        issueDate: f.issueDate,
        expiryDate: f.expiryDate,
        ...(f.builder ? { builder: f.builder, controlFamily: f.controlFamily, level: f.level } : {}),
      };
      expect(claimed).toEqual(printed);
    }
  });
});

describe("demo technicians", () => {
  const world = buildDemoWorld(TODAYS[0]!);

  it("are three or four per service company", () => {
    const service = world.companies.filter((c) => c.kind === "service");

    for (const company of service) {
      const count = world.technicians.filter((t) => t.companyKey === company.key).length;
      expect(count).toBeGreaterThanOrEqual(3);
      expect(count).toBeLessThanOrEqual(4);
    }
  });

  it("live at ZIP codes the offline data resolves, within 60 km of their company's office", () => {
    for (const technician of world.technicians) {
      const company = world.companies.find((c) => c.key === technician.companyKey)!;
      const home = lookupPostalCode(technician.postalCode);
      const office = lookupPostalCode(company.postalCode);
      expect(home, technician.postalCode).toBeDefined();
      const distance = greatCircleDistanceKm(
        { lat: home!.latitude, lon: home!.longitude },
        { lat: office!.latitude, lon: office!.longitude },
      );
      expect(distance, technician.key).toBeLessThan(60);
    }
  });

  it("serve known technologies within 80-300 km at 120-175 $/h on site and 85-110 $/h travelling", () => {
    for (const t of world.technicians) {
      expect(t.technologies.every((tech) => (machineTechnologies as readonly string[]).includes(tech))).toBe(
        true,
      );
      expect([t.serviceRadiusKm >= 80, t.serviceRadiusKm <= 300]).toEqual([true, true]);
      expect([t.hourlyRateCents >= 120_00, t.hourlyRateCents <= 175_00]).toEqual([true, true]);
      expect([t.travelRateCents >= 85_00, t.travelRateCents <= 110_00]).toEqual([true, true]);
    }
  });

  it("are linked from every technician user, and hold at least one credential each", () => {
    const links = world.companies.flatMap((c) =>
      c.users.filter((u) => u.role === "technician").map((u) => u.technicianKey),
    );
    const keys = new Set(world.technicians.map((t) => t.key));
    const withoutCredentials = world.technicians.filter(
      (t) => !world.credentials.some((c) => c.technicianKey === t.key),
    );

    expect(links.every((key) => key !== undefined && keys.has(key))).toBe(true);
    expect(withoutCredentials).toEqual([]);
  });
});
