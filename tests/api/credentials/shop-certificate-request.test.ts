import { describe, expect, it } from "vitest";
import request from "supertest";
import { useTestApp } from "../../support/test-app.ts";
import { buildProvider, signedInAgent } from "../../support/build-provider.ts";
import { certificateFields } from "../../support/submit-credential.ts";
import { useMailCatcher } from "../../support/mail-catcher.ts";
import { buildCertificatePdf } from "../../fixtures/build-certificate-pdf.ts";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../../shared/api/error-body.ts";
import { Document } from "../../../server/credentials/model.ts";
import { Notification } from "../../../server/notices/model.ts";
import { db } from "../../../server/db/sequelize.ts";

const t = useTestApp();
const mail = useMailCatcher();

type Provider = Awaited<ReturnType<typeof buildProvider>>;
type Shop = Awaited<ReturnType<typeof signedInAgent>>;

async function recordBroker(provider: Provider, typeCode?: string) {
  const email = `broker-${provider.company.id}-${typeCode ?? "all"}@agency.example.test`;
  await provider.admin
    .put("/api/broker-contacts")
    .send({ typeCode, agency: "Fenwick Mill Insurance Agency", contactName: "Aurelio Damsgaard", email })
    .expect(200);
  return email;
}

async function putOnRoster(shop: Shop, provider: Provider) {
  await db().query(
    "INSERT INTO roster_entries (shop_company_id, service_company_id, added_by) VALUES ($1, $2, $3)",
    { bind: [shop.company.id, provider.company.id, shop.user.id] },
  );
}

async function tokenMailedTo(email: string): Promise<string> {
  await mail.deliver();
  const match = /\/broker-upload\/([A-Za-z0-9_-]+)/.exec(mail.to(email).at(-1)!.text);
  expect(match).not.toBeNull();
  return match![1]!;
}

const ask = (
  shop: Shop,
  provider: Provider,
  holderRole = "additional_insured",
  typeCode = "general_liability",
) =>
  shop.agent
    .post("/api/certificate-requests")
    .send({ serviceCompanyId: provider.company.id, typeCode, holderRole });

describe("a shop asks a service company's broker for a certificate naming it", () => {
  it("sends the coverage's broker a one-time link, tells the office, and tells the shop once it is verified", async () => {
    const provider = await buildProvider(t.app);
    await recordBroker(provider);
    const liabilityBroker = await recordBroker(provider, "general_liability");
    const shop = await signedInAgent(t.app, "shop", "buyer");
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");
    await putOnRoster(shop, provider);

    const asked = await ask(shop, provider);
    const token = await tokenMailedTo(liabilityBroker);
    const brokerMail = mail.to(liabilityBroker).at(-1)!;
    const officeBell = await Notification.findAll({ where: { userId: provider.adminUser.id } });
    const page = await request(t.app).get(`/api/broker-uploads/${token}`).set(CSRF_HEADER, CSRF_HEADER_VALUE);
    const { bytes, values } = await buildCertificatePdf({ seed: 71 });
    const first = await request(t.app)
      .post(`/api/broker-uploads/${token}`)
      .set(CSRF_HEADER, CSRF_HEADER_VALUE)
      .attach("file", Buffer.from(bytes), "holder.pdf");
    const second = await request(t.app)
      .post(`/api/broker-uploads/${token}`)
      .set(CSRF_HEADER, CSRF_HEADER_VALUE)
      .attach("file", Buffer.from(bytes), "holder.pdf");
    const document = await Document.findOne({ where: { companyId: provider.company.id } });
    const submitted = await provider.admin.post("/api/credentials").send({
      documentId: document!.id,
      typeCode: "general_liability",
      fields: certificateFields(values, "general_liability"),
    });
    const beforeVerify = await shop.agent.get("/api/certificate-requests");
    await reviewer.post(`/api/credentials/${submitted.body.id}/verify`).send({}).expect(200);
    await mail.deliver();
    const afterVerify = await shop.agent.get("/api/certificate-requests");
    const officeList = await provider.admin.get("/api/broker-requests");

    expect(asked.status).toBe(201);
    expect(asked.body).toMatchObject({
      companyName: provider.company.name,
      holderRole: "additional_insured",
      linkState: "sent",
    });
    expect(JSON.stringify(asked.body)).not.toContain(liabilityBroker);
    expect(brokerMail.text).toContain(shop.company.name);
    expect(brokerMail.text).toContain("additional insured");
    expect(officeBell.map((n) => n.kind)).toContain("broker_request_from_shop");
    expect(page.body).toMatchObject({
      certificateHolder: shop.company.name,
      holderRole: "additional_insured",
    });
    expect(first.status).toBe(201);
    // RFC 9110 §15.5.11: the spent link is gone.
    expect(second.status).toBe(410);
    expect(document!.uploadedBy).toBe(provider.adminUser.id);
    expect(beforeVerify.body.requests[0]).toMatchObject({ linkState: "used", verifiedAt: null });
    expect(afterVerify.body.requests[0].verifiedAt).not.toBeNull();
    expect(
      await Notification.count({ where: { userId: shop.user.id, kind: "broker_certificate_verified" } }),
    ).toBe(1);
    expect(mail.to(shop.user.email).map((m) => m.subject)).toEqual([expect.stringContaining("Verified")]);
    expect(officeList.body[0]).toMatchObject({
      origin: "shop",
      shopName: shop.company.name,
      linkState: "used",
    });
  });

  it("shows the request only to the shop that asked and the company asked", async () => {
    const provider = await buildProvider(t.app);
    const otherProvider = await buildProvider(t.app);
    await recordBroker(provider);
    const shop = await signedInAgent(t.app, "shop", "buyer");
    const otherShop = await signedInAgent(t.app, "shop", "buyer");
    await putOnRoster(shop, provider);
    await ask(shop, provider).expect(201);

    const theirs = await otherShop.agent.get("/api/certificate-requests");
    const otherOffice = await otherProvider.admin.get("/api/broker-requests");
    const office = await provider.admin.get("/api/broker-requests");
    const mine = await shop.agent.get("/api/certificate-requests");

    expect(mine.body.requests).toHaveLength(1);
    expect(mine.body.companies).toEqual([{ id: provider.company.id, name: provider.company.name }]);
    expect(theirs.body.requests).toEqual([]);
    expect(theirs.body.companies).toEqual([]);
    expect(otherOffice.body).toEqual([]);
    expect(office.body).toHaveLength(1);
  });

  it("answers 404 for a company the shop does not work with, so it cannot mail any company's broker", async () => {
    const provider = await buildProvider(t.app);
    await recordBroker(provider);
    const stranger = await signedInAgent(t.app, "shop", "buyer");

    const res = await ask(stranger, provider);

    expect(res.status).toBe(404);
    expect(await Document.count({ where: { companyId: provider.company.id } })).toBe(0);
  });

  it("refuses a second ask while the link is open, a company without a broker, and a bad role, naming the field", async () => {
    const provider = await buildProvider(t.app);
    const noBroker = await buildProvider(t.app);
    await recordBroker(provider);
    const shop = await signedInAgent(t.app, "shop", "buyer");
    await putOnRoster(shop, provider);
    await putOnRoster(shop, noBroker);

    const first = await ask(shop, provider, "certificate_holder");
    const again = await ask(shop, provider, "certificate_holder");
    const missing = await ask(shop, noBroker);
    const badRole = await ask(shop, provider, "landlord");
    const notCoverage = await ask(shop, provider, "certificate_holder", "lockout_tagout");

    expect(first.status).toBe(201);
    expect(again.status).toBe(409);
    expect(missing.status).toBe(422);
    expect(missing.body.error.fields[0]).toEqual({
      path: "body.typeCode",
      message: "no broker on file for this coverage",
    });
    expect(badRole.status).toBe(422);
    expect(badRole.body.error.fields[0].path).toBe("body.holderRole");
    expect(notCoverage.status).toBe(422);
  });

  it("is for shops only", async () => {
    const provider = await buildProvider(t.app);

    const anonymous = await request(t.app).get("/api/certificate-requests");
    const office = await provider.admin.get("/api/certificate-requests");

    expect(anonymous.status).toBe(401);
    expect(office.status).toBe(403);
  });
});
