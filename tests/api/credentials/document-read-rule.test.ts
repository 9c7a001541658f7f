import { describe, expect, it } from "vitest";
import { agentFor, useTestApp } from "../../support/test-app.ts";
import { buildProvider } from "../../support/build-provider.ts";
import { TEST_PASSWORD } from "../../support/build-company.ts";
import { buildCertificatePdf } from "../../fixtures/build-certificate-pdf.ts";
import { buildTrainingCardPdf } from "../../fixtures/build-training-card.ts";
import { certificateFields } from "../../support/submit-credential.ts";
import { buildWorkOrderWorld, workOrderAt } from "../../fixtures/build-work-order-world.ts";
import { Technician } from "../../../server/technicians/model.ts";
import { User } from "../../../server/accounts/model.ts";
import { Credential } from "../../../server/credentials/model.ts";

const t = useTestApp();

type Provider = Awaited<ReturnType<typeof buildProvider>>;

/** A second technician of the same company, with a sign-in of their own. */
async function colleagueOf(provider: Provider) {
  const technician = await Technician.create({
    ...provider.technician.get({ plain: true }),
    id: undefined as never,
    name: `Colleague of ${provider.technician.name}`,
  });
  const user = await User.create({
    companyId: provider.company.id,
    email: `colleague-${technician.id}@example.test`,
    name: technician.name,
    role: "technician",
    passwordHash: provider.adminUser.passwordHash,
    technicianId: technician.id,
  });
  const agent = agentFor(t.app);
  await agent.post("/api/auth/sign-in").send({ email: user.email, password: TEST_PASSWORD }).expect(200);
  return { technician, agent };
}

async function uploadCard(agent: Provider["admin"], technicianId: number | undefined, seed: number) {
  const { bytes } = await buildTrainingCardPdf({ seed });
  const req = agent.post("/api/documents").field("typeCode", "arc_flash");
  if (technicianId !== undefined) req.field("technicianId", String(technicianId));
  const res = await req.attach("file", Buffer.from(bytes), "card.pdf");
  expect(res.status).toBe(201);
  return res.body.document.id as number;
}

async function uploadCertificate(agent: Provider["admin"], seed: number, typeCode = "general_liability") {
  const { bytes, values } = await buildCertificatePdf({ seed });
  const res = await agent
    .post("/api/documents")
    .field("typeCode", typeCode)
    .attach("file", Buffer.from(bytes), "coi.pdf");
  expect(res.status).toBe(201);
  return { id: res.body.document.id as number, values };
}

const cardFields = { holderName: "Rosalind Tennant", issueDate: "2025-03-04" };

describe("a credential stands only on a file its submitter may already read", () => {
  it("refuses a technician's claim on a colleague's card, the company's certificate or a work-order attachment, and the file stays unreadable", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const provider = world.provider;
    const colleague = await colleagueOf(provider);
    const colleaguesCard = await uploadCard(provider.admin, colleague.technician.id, 31);
    const certificate = await uploadCertificate(provider.admin, 32);
    const id = await workOrderAt(world, "accepted");
    const { bytes } = await buildCertificatePdf({ seed: 33 });
    const posted = await provider.admin
      .post(`/api/work-orders/${id}/messages`)
      .field("body", "Quote attached")
      .attach("file", Buffer.from(bytes), "quote.pdf");
    const attachment = posted.body.attachment.documentId as number;

    const attempts = [
      { documentId: colleaguesCard, typeCode: "arc_flash", fields: cardFields },
      // Named as the technician's own card: the file, not the type, is what must be theirs.
      { documentId: certificate.id, typeCode: "arc_flash", fields: cardFields },
      { documentId: attachment, typeCode: "arc_flash", fields: cardFields },
    ];
    const before = await Credential.count();
    const fileStatus = async (documentId: number) =>
      (await provider.tech.get(`/api/documents/${documentId}/file`)).status;
    const readableBefore = await Promise.all(attempts.map((a) => fileStatus(a.documentId)));
    for (const attempt of attempts) {
      const res = await provider.tech.post("/api/credentials").send(attempt);

      expect(res.status).toBe(422);
      expect(res.body.error.fields.map((f: { path: string }) => f.path)).toContain("body.documentId");
    }
    // The colleague's card and the company's certificate stay closed; the attachment stays what it was (this
    // technician is a party of that work order).
    expect(readableBefore).toEqual([404, 404, 200]);
    expect(await Promise.all(attempts.map((a) => fileStatus(a.documentId)))).toEqual(readableBefore);
    expect(await Credential.count()).toBe(before);
  });

  it("never takes a work-order attachment as a credential document, even from the office that posted it", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "accepted");
    const { bytes, values } = await buildCertificatePdf({ seed: 34 });
    const posted = await world.provider.admin
      .post(`/api/work-orders/${id}/messages`)
      .field("body", "Our certificate")
      .attach("file", Buffer.from(bytes), "coi.pdf");

    const res = await world.provider.admin.post("/api/credentials").send({
      documentId: posted.body.attachment.documentId,
      typeCode: "general_liability",
      fields: certificateFields(values, "general_liability"),
    });

    expect(res.status).toBe(422);
    expect(res.body.error.fields[0]).toEqual({ path: "body.documentId", message: "unknown document" });
  });

  it("holds the office to the kind and the holder the file was uploaded for", async () => {
    const provider = await buildProvider(t.app);
    const colleague = await colleagueOf(provider);
    const card = await uploadCard(provider.admin, provider.technician.id, 35);
    const certificate = await uploadCertificate(provider.admin, 36);
    const fields = certificateFields(certificate.values, "auto_liability");

    const otherHolder = await provider.admin.post("/api/credentials").send({
      documentId: card,
      typeCode: "arc_flash",
      technicianId: colleague.technician.id,
      fields: cardFields,
    });
    const otherKind = await provider.admin
      .post("/api/credentials")
      .send({ documentId: card, typeCode: "auto_liability", fields });
    // One certificate of insurance lists several coverages: the same kind of document backs each of them.
    const sameKind = await provider.admin
      .post("/api/credentials")
      .send({ documentId: certificate.id, typeCode: "auto_liability", fields });

    expect(otherHolder.status).toBe(422);
    expect(otherHolder.body.error.fields[0].path).toBe("body.documentId");
    expect(otherKind.status).toBe(422);
    expect(otherKind.body.error.fields[0].path).toBe("body.documentId");
    expect(sameKind.status).toBe(201);
  });
});

describe("the list and the single read of credentials agree", () => {
  it("shows a technician their own cards only, in the list as in the single read", async () => {
    const provider = await buildProvider(t.app);
    const colleague = await colleagueOf(provider);
    const certificate = await uploadCertificate(provider.admin, 37);
    const company = await provider.admin.post("/api/credentials").send({
      documentId: certificate.id,
      typeCode: "general_liability",
      fields: certificateFields(certificate.values, "general_liability"),
    });
    const theirs = await provider.admin.post("/api/credentials").send({
      documentId: await uploadCard(provider.admin, colleague.technician.id, 38),
      typeCode: "arc_flash",
      technicianId: colleague.technician.id,
      fields: cardFields,
    });
    const own = await provider.tech.post("/api/credentials").send({
      documentId: await uploadCard(provider.tech, undefined, 39),
      typeCode: "arc_flash",
      fields: cardFields,
    });
    expect([company.status, theirs.status, own.status]).toEqual([201, 201, 201]);

    const companyList = await provider.tech.get("/api/credentials?holder=company");
    const fullList = await provider.tech.get("/api/credentials");
    const singles = await Promise.all(
      [company.body.id, theirs.body.id, own.body.id].map(
        async (id: number) => [id, (await provider.tech.get(`/api/credentials/${id}`)).status] as const,
      ),
    );

    expect(companyList.status).toBe(200);
    expect(companyList.body).toEqual([]);
    expect(fullList.body.map((c: { id: number }) => c.id)).toEqual([own.body.id]);
    const readable = singles.filter(([, status]) => status === 200).map(([id]) => id);
    expect(readable).toEqual(fullList.body.map((c: { id: number }) => c.id));
    expect(singles.filter(([, status]) => status !== 200).every(([, status]) => status === 404)).toBe(true);
  });

  it("still gives the office every credential of its company", async () => {
    const provider = await buildProvider(t.app);
    const certificate = await uploadCertificate(provider.admin, 40);
    const company = await provider.admin.post("/api/credentials").send({
      documentId: certificate.id,
      typeCode: "general_liability",
      fields: certificateFields(certificate.values, "general_liability"),
    });

    const listed = await provider.admin.get("/api/credentials?holder=company");
    const single = await provider.admin.get(`/api/credentials/${company.body.id}`);

    expect(listed.body.map((c: { id: number }) => c.id)).toEqual([company.body.id]);
    expect(single.status).toBe(200);
  });
});
