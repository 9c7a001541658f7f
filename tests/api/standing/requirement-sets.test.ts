import { randomUUID } from "node:crypto";
import { describe, expect, it } from "vitest";
import request from "supertest";
import { useTestApp } from "../../support/test-app.ts";
import { buildCompany } from "../../support/build-company.ts";
import {
  buildClearedProvider,
  buildCredentialRow,
  insuranceFields,
  oemFields,
  trainingFields,
} from "../../fixtures/build-credential-row.ts";
import { Technician } from "../../../server/technicians/model.ts";
import { RequirementSet } from "../../../server/standing/model.ts";
import { Credential } from "../../../server/credentials/model.ts";
import { db } from "../../../server/db/sequelize.ts";
import { loadStandingInputs } from "../../../server/standing/standing-inputs.ts";
import { computeStandings } from "../../../server/standing/compute-stored-standings.ts";
import { MAX_ACTIVE_REQUIREMENT_SETS_PER_SHOP } from "../../../shared/standing/requirement-set-limits.ts";
import { addCalendarDays } from "../../../shared/standing/iso-date.ts";
import { calendarDateIn } from "../../../shared/dates/local-time.ts";
import type { Requirement } from "../../../shared/standing/requirements.ts";
import { signIn } from "./sign-in-as.ts";

const t = useTestApp();

// The providers built here keep their books in Chicago: "today" is the date there, which trails UTC's in the evening.
const todayInChicago = () => calendarDateIn(new Date(), "America/Chicago");

async function buyer() {
  const { company, users } = await buildCompany("shop", ["buyer", "provider_admin"]);
  return { company, agent: await signIn(t.app, users.buyer!.email), users };
}

/** A set only this test's technicians can meet: training from a builder named for this test alone. */
function spindleSet(builder: string, minLevel = 2) {
  return {
    name: "On-site spindle work",
    requirements: [
      {
        label: "General liability 1M / 2M",
        typeCodes: ["general_liability"],
        minLimits: { eachOccurrence: 1_000_000, generalAggregate: 2_000_000 },
      },
      { label: "Arc-flash training", typeCodes: ["arc_flash"] },
      {
        label: `${builder} training, level ${minLevel}`,
        typeCodes: ["oem_training"],
        builder,
        controlFamily: "Tessaline 9",
        minLevel,
      },
    ],
  };
}

async function qualifiedTechnician(builder: string) {
  const p = await buildClearedProvider({ glExpires: "2099-07-15", wcExpires: "2099-07-15" });
  const base = { companyId: p.company.id, technicianId: p.technician.id, submittedBy: p.admin.id };
  await buildCredentialRow({
    ...base,
    typeCode: "arc_flash",
    fields: trainingFields({ issueDate: todayInChicago() }),
  });
  await buildCredentialRow({
    ...base,
    typeCode: "oem_training",
    fields: oemFields({ builder, expiryDate: "2099-01-01" }),
  });
  return p;
}

describe("requirement sets", () => {
  it("lets a buyer define a set and stores every technician's standing against it", async () => {
    const builder = `Orrin Works ${randomUUID().slice(0, 6)}`;
    const meets = await qualifiedTechnician(builder);
    const { agent, company } = await buyer();

    const created = await agent.post("/api/requirement-sets").send(spindleSet(builder));
    const listed = await agent.get("/api/requirement-sets");
    const preview = await agent.get(`/api/requirement-sets/${created.body.id}/preview`);
    const technicians = await Technician.count({ where: { active: true } });

    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({
      companyId: company.id,
      name: "On-site spindle work",
      active: true,
      siteId: null,
    });
    expect(listed.body.map((s: { id: number }) => s.id)).toEqual([created.body.id]);
    expect(preview.body).toEqual({
      technicians,
      cleared: 1,
      lapsing: 0,
      meeting: 1,
      notCleared: technicians - 1,
    });
    // The service side sees a shop's sets once that shop works with the technician (here: its roster).
    const hidden = await (
      await signIn(t.app, meets.admin.email)
    ).get(`/api/technicians/${meets.technician.id}/standing`);
    await agent.post("/api/roster").send({ serviceCompanyId: meets.company.id }).expect(201);
    const standing = await (
      await signIn(t.app, meets.admin.email)
    ).get(`/api/technicians/${meets.technician.id}/standing`);
    expect(hidden.body.requirementSets).toEqual([]);
    expect(standing.body.requirementSets).toEqual([
      expect.objectContaining({
        requirementSetId: created.body.id,
        name: "On-site spindle work",
        standing: "cleared",
      }),
    ]);
  });

  it("previews an unsaved set: how many active technicians meet it today", async () => {
    const builder = `Orrin Works ${randomUUID().slice(0, 6)}`;
    await qualifiedTechnician(builder);
    await qualifiedTechnician(builder);
    const { agent } = await buyer();

    const res = await agent.post("/api/requirement-sets/preview").send(spindleSet(builder));

    expect(res.status).toBe(200);
    expect(res.body.meeting).toBe(2);
    expect(res.body.cleared + res.body.lapsing).toBe(2);
    expect(res.body.technicians).toBe(res.body.meeting + res.body.notCleared);
  });

  it("revises a set and recomputes the standings against it", async () => {
    const builder = `Orrin Works ${randomUUID().slice(0, 6)}`;
    await qualifiedTechnician(builder);
    const { agent } = await buyer();
    const created = await agent.post("/api/requirement-sets").send(spindleSet(builder));
    const stricter = spindleSet(builder, 3);

    const res = await agent.put(`/api/requirement-sets/${created.body.id}`).send(stricter);
    const preview = await agent.get(`/api/requirement-sets/${created.body.id}/preview`);

    expect(res.status).toBe(200);
    expect(preview.body.meeting).toBe(0);
  });

  it("archives a set rather than deleting it, and drops it from the list", async () => {
    const { agent } = await buyer();
    const created = await agent.post("/api/requirement-sets").send(spindleSet("Orrin Machine Works"));

    const archived = await agent.delete(`/api/requirement-sets/${created.body.id}`);
    const listed = await agent.get("/api/requirement-sets");
    const all = await agent.get("/api/requirement-sets?includeArchived=true");

    expect(archived.status).toBe(200);
    expect(archived.body.active).toBe(false);
    expect(listed.body).toEqual([]);
    expect(all.body.map((s: { id: number }) => s.id)).toEqual([created.body.id]);
  });

  it("answers 422 naming the field when a set has no requirements", async () => {
    const { agent } = await buyer();

    const res = await agent.post("/api/requirement-sets").send({ name: "Empty", requirements: [] });

    expect(res.status).toBe(422);
    expect(res.body.error.fields).toEqual([
      { path: "body.requirements", message: "Add at least one requirement" },
    ]);
  });

  it("answers 422 naming the exact type code the catalogue does not know", async () => {
    const { agent } = await buyer();

    const res = await agent
      .post("/api/requirement-sets")
      .send({ name: "Odd", requirements: [{ label: "x", typeCodes: ["arc_flash", "moon_walking"] }] });

    expect(res.status).toBe(422);
    expect(res.body.error.fields).toEqual([
      { path: "body.requirements.0.typeCodes.1", message: "Unknown credential type moon_walking" },
    ]);
  });

  it("answers 422 to additional insured on workers' compensation, which no certificate can show, and saves nothing", async () => {
    const { agent } = await buyer();
    const body = {
      name: `WC with AI ${Date.now()}`,
      requirements: [
        { label: "General liability", typeCodes: ["general_liability"], additionalInsured: true },
        { label: "Workers' comp", typeCodes: ["workers_comp"], additionalInsured: true },
      ],
    };

    const res = await agent.post("/api/requirement-sets").send(body);
    const listed = await agent.get("/api/requirement-sets");

    // Common practice (from memory: the ACORD 25 certificate leaves "ADDL INSD" unused on the workers' comp line).
    expect(res.status).toBe(422);
    expect(res.body.error.fields).toEqual([
      {
        path: "body.requirements.1.additionalInsured",
        message:
          "Additional insured cannot apply to workers' compensation: no certificate can show it. Ask for a waiver of subrogation instead.",
      },
    ]);
    expect(listed.body.map((set: { name: string }) => set.name)).not.toContain(body.name);
  });

  it("answers 401 when signed out", async () => {
    const res = await request(t.app).get("/api/requirement-sets");

    expect(res.status).toBe(401);
  });

  it("answers 403 to a provider admin", async () => {
    const { users } = await buyer();
    const provider = await signIn(t.app, users.provider_admin!.email);

    const res = await provider.post("/api/requirement-sets").send(spindleSet("Orrin Machine Works"));

    expect(res.status).toBe(403);
  });

  it("answers 404 for another shop's set, on read, edit, archive and preview", async () => {
    const owner = await buyer();
    const other = await buyer();
    const created = await owner.agent.post("/api/requirement-sets").send(spindleSet("Orrin Machine Works"));
    const path = `/api/requirement-sets/${created.body.id}`;

    const answers = await Promise.all([
      other.agent.get(path),
      other.agent.put(path).send(spindleSet("Orrin Machine Works")),
      other.agent.delete(path),
      other.agent.get(`${path}/preview`),
    ]);

    expect(answers.map((r) => r.status)).toEqual([404, 404, 404, 404]);
    expect((await owner.agent.get(path)).body.active).toBe(true);
  });
});

describe("a set's site and the number of sets", () => {
  it("answers 422 naming body.siteId for another shop's site or an unknown one, on create and on revise", async () => {
    const owner = await buyer();
    const other = await buyer();
    const foreignSite = await other.agent
      .post("/api/sites")
      .send({ name: "North Plant", addressLine: "400 Lathe Street", postalCode: "60601" });
    const ownSite = await owner.agent
      .post("/api/sites")
      .send({ name: "South Plant", addressLine: "12 Gear Court", postalCode: "60601" });
    const created = await owner.agent
      .post("/api/requirement-sets")
      .send({ ...spindleSet("Orrin Machine Works"), siteId: ownSite.body.id });

    const answers = await Promise.all([
      owner.agent.post("/api/requirement-sets").send({ ...spindleSet("x"), siteId: foreignSite.body.id }),
      owner.agent.post("/api/requirement-sets").send({ ...spindleSet("x"), siteId: 2_000_000_000 }),
      owner.agent
        .put(`/api/requirement-sets/${created.body.id}`)
        .send({ ...spindleSet("x"), siteId: foreignSite.body.id }),
    ]);

    expect(created.status).toBe(201);
    expect(created.body.siteId).toBe(ownSite.body.id);
    for (const res of answers) {
      expect(res.status).toBe(422);
      expect(res.body.error.fields).toEqual([{ path: "body.siteId", message: "unknown site" }]);
    }
    const stored = await RequirementSet.findAll({ where: { companyId: owner.company.id } });
    expect(stored.map((r) => r.siteId)).toEqual([ownSite.body.id]);
  });

  it(`keeps at most ${MAX_ACTIVE_REQUIREMENT_SETS_PER_SHOP} active sets per shop, and makes room when one is archived`, async () => {
    const { agent, company } = await buyer();
    await RequirementSet.bulkCreate(
      Array.from({ length: MAX_ACTIVE_REQUIREMENT_SETS_PER_SHOP }, (_, i) => ({
        companyId: company.id,
        siteId: null,
        name: `Set ${i}`,
        requirements: spindleSet("Orrin Machine Works").requirements as unknown as Requirement[],
      })),
    );

    const refused = await agent.post("/api/requirement-sets").send(spindleSet("Orrin Machine Works"));
    const first = await RequirementSet.findOne({ where: { companyId: company.id } });
    await agent.delete(`/api/requirement-sets/${first!.id}`).expect(200);
    const accepted = await agent.post("/api/requirement-sets").send(spindleSet("Orrin Machine Works"));

    expect(refused.status).toBe(422);
    expect(refused.body.error.message).toMatch(String(MAX_ACTIVE_REQUIREMENT_SETS_PER_SHOP));
    expect(refused.body.error.fields[0].path).toBe("body");
    expect(accepted.status).toBe(201);
    expect(await RequirementSet.count({ where: { companyId: company.id, active: true } })).toBe(
      MAX_ACTIVE_REQUIREMENT_SETS_PER_SHOP,
    );
  });
});

describe("the preview of an unsaved set", () => {
  /** Every active technician through the full engine, as the stored standings are computed: the reference answer. */
  async function fullEvaluation(requirements: Requirement[]) {
    const standings = await db().transaction(async (transaction) => {
      const inputs = await loadStandingInputs("all", transaction, {
        targets: [{ id: -1, name: "draft", requirements }],
      });
      return computeStandings(
        inputs,
        new Date(),
        inputs.technicians.filter((t) => t.active),
      ).map((s) => s.standing);
    });
    const cleared = standings.filter((s) => s === "cleared").length;
    const lapsing = standings.filter((s) => s === "lapsing").length;
    return {
      technicians: standings.length,
      cleared,
      lapsing,
      meeting: cleared + lapsing,
      notCleared: standings.length - cleared - lapsing,
    };
  }

  it("counts what the full engine counts: lapsing soon, carried by a renewal, below the level, awaiting verification", async () => {
    const builder = `Orrin Works ${randomUUID().slice(0, 6)}`;
    const today = todayInChicago();
    const cleared = await qualifiedTechnician(builder);
    const lapsing = await qualifiedTechnician(builder);
    const renewed = await qualifiedTechnician(builder);
    const lowLevel = await qualifiedTechnician(builder);
    const unverified = await qualifiedTechnician(builder);
    const soon = addCalendarDays(today, 20);
    for (const p of [lapsing, renewed]) {
      await p.generalLiability.update({ state: "superseded" });
      await buildCredentialRow({
        companyId: p.company.id,
        submittedBy: p.admin.id,
        typeCode: "general_liability",
        fields: insuranceFields({ effectiveDate: addCalendarDays(today, -345), expirationDate: soon }),
      });
    }
    await buildCredentialRow({
      companyId: renewed.company.id,
      submittedBy: renewed.admin.id,
      typeCode: "general_liability",
      fields: insuranceFields({ effectiveDate: soon, expirationDate: addCalendarDays(soon, 365) }),
    });
    await buildCredentialRow({
      companyId: lowLevel.company.id,
      technicianId: lowLevel.technician.id,
      submittedBy: lowLevel.admin.id,
      typeCode: "oem_training",
      fields: oemFields({ builder, level: 1, expiryDate: "2099-01-01" }),
    });
    await Credential.update(
      { state: "submitted" },
      { where: { technicianId: unverified.technician.id, typeCode: "oem_training" } },
    );
    const set = spindleSet(builder, 3);
    await Credential.update(
      { fields: oemFields({ builder, level: 3, expiryDate: "2099-01-01" }) as never },
      {
        where: {
          technicianId: [
            cleared.technician.id,
            lapsing.technician.id,
            renewed.technician.id,
            unverified.technician.id,
          ],
          typeCode: "oem_training",
        },
      },
    );
    const { agent } = await buyer();

    const res = await agent.post("/api/requirement-sets/preview").send(set);
    const reference = await fullEvaluation(set.requirements as unknown as Requirement[]);

    expect(res.status).toBe(200);
    expect(res.body).toEqual(reference);
    // Of this test's technicians: two cleared (one carried on by its renewal), one lapsing, two short.
    expect({ cleared: res.body.cleared, lapsing: res.body.lapsing }).toEqual({ cleared: 2, lapsing: 1 });
  });
});
