import { describe, expect, it } from "vitest";
import { useTestApp } from "../../support/test-app.ts";
import { buildProvider, signedInAgent } from "../../support/build-provider.ts";
import { buildTechnician } from "../../fixtures/build-credential-row.ts";
import { buildCertificatePdf } from "../../fixtures/build-certificate-pdf.ts";

// Common practice, varies by state: a state's workers' compensation exemption names persons (a sole proprietor or
// officers) and clears only them, never the company's employees; none printed, it counts 24 months from issue.
const t = useTestApp();

type Agent = Awaited<ReturnType<typeof buildProvider>>["admin"];

async function submitExemption(agent: Agent, seed: number, fields: Record<string, unknown>) {
  const { bytes } = await buildCertificatePdf({ seed });
  const up = await agent
    .post("/api/documents")
    .field("typeCode", "workers_comp_exemption")
    .attach("file", Buffer.from(bytes), `exemption-${seed}.pdf`)
    .expect(201);
  return agent.post("/api/credentials").send({
    documentId: up.body.document.id,
    typeCode: "workers_comp_exemption",
    fields: {
      holderName: "Field office",
      state: "IL",
      certificateNumber: `EX-${seed}`,
      issueDate: "2026-06-01",
      ...fields,
    },
  });
}

const workersCompLine = async (agent: Agent, technicianId: number) => {
  const res = await agent.get(`/api/technicians/${technicianId}/standing`).expect(200);
  return res.body.baseline.results[1];
};

describe("a workers' compensation exemption on file", () => {
  it("stores the persons it names and its usual 24-month term, and clears only the person named", async () => {
    const p = await buildProvider(t.app);
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");

    const res = await submitExemption(p.admin, 301, { personsCovered: [p.technician.name] });
    await reviewer.post(`/api/credentials/${res.body.id}/verify`).send({}).expect(200);

    expect(res.status).toBe(201);
    expect(res.body.fields).toMatchObject({ personsCovered: [p.technician.name], technicianIds: [] });
    // Issued 2026-06-01 with no printed expiry: counts through 2028-06-01, ends at 2028-06-02 00:00 CDT (UTC-5).
    expect(res.body.lapsesAt).toBe("2028-06-02T05:00:00.000Z");
    expect(await workersCompLine(p.admin, p.technician.id)).toMatchObject({ status: "met", reason: null });
  });

  it("does not clear an employee it does not name, nor the officer of a company with employees", async () => {
    const p = await buildProvider(t.app);
    const employee = await buildTechnician(p.company.id);
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");

    const res = await submitExemption(p.admin, 302, { personsCovered: [p.technician.name] });
    await reviewer.post(`/api/credentials/${res.body.id}/verify`).send({}).expect(200);

    expect(await workersCompLine(p.admin, employee.id)).toMatchObject({
      status: "unmet",
      reason: "exemption_does_not_cover",
    });
    const officer = await workersCompLine(p.admin, p.technician.id);
    expect(officer).toMatchObject({ status: "unmet", reason: "exemption_does_not_cover" });
    expect(officer.detail).toContain("2 technicians");
  });

  it("clears a technician ticked by id, and refuses another company's technician without saving", async () => {
    const p = await buildProvider(t.app);
    const other = await buildProvider(t.app);
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");

    const refused = await submitExemption(p.admin, 303, { technicianIds: [other.technician.id] });
    const own = await submitExemption(p.admin, 304, { technicianIds: [p.technician.id] });
    await reviewer.post(`/api/credentials/${own.body.id}/verify`).send({}).expect(200);
    const listed = await p.admin.get("/api/credentials");

    expect(refused.status).toBe(422);
    expect(refused.body.error.fields).toEqual([
      { path: "body.fields.technicianIds", message: "name technicians of this company only" },
    ]);
    expect(listed.body.map((c: { id: number }) => c.id)).toEqual([own.body.id]);
    expect(await workersCompLine(p.admin, p.technician.id)).toMatchObject({ status: "met" });
  });
});
