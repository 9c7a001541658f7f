import { createHash } from "node:crypto";
import { readdir } from "node:fs/promises";
import { describe, expect, it } from "vitest";
import request from "supertest";
import { useTestApp } from "../../support/test-app.ts";
import { buildProvider, signedInAgent } from "../../support/build-provider.ts";
import { submitLiabilityCertificate, certificateFields } from "../../support/submit-credential.ts";
import { useMailCatcher } from "../../support/mail-catcher.ts";
import { buildCertificatePdf } from "../../fixtures/build-certificate-pdf.ts";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../../shared/api/error-body.ts";
import { Document } from "../../../server/credentials/model.ts";
import { BrokerUploadRequest } from "../../../server/credentials/broker-model.ts";
import { Notification } from "../../../server/notices/model.ts";
import { remindBrokers } from "../../../server/credentials/broker-reminders.ts";

const t = useTestApp();
const mail = useMailCatcher();

type Provider = Awaited<ReturnType<typeof buildProvider>>;

async function recordBroker(provider: Provider) {
  const email = `broker-${provider.company.id}@agency.example.test`;
  const res = await provider.admin
    .put("/api/broker-contacts")
    .send({ agency: "Harrow Lane Insurance Agency", contactName: "Odile Prentiss", email });
  expect(res.status).toBe(200);
  return email;
}

/** The token the broker received: read from the link in the delivered e-mail, the only place it exists. */
async function tokenMailedTo(email: string): Promise<string> {
  await mail.deliver();
  const messages = mail.to(email);
  const last = messages[messages.length - 1]!;
  const match = /\/broker-upload\/([A-Za-z0-9_-]+)/.exec(last.text);
  expect(match).not.toBeNull();
  return match![1]!;
}

const anonymous = () => request(t.app);
const upload = (token: string, bytes: Uint8Array | Buffer, name: string) =>
  anonymous()
    .post(`/api/broker-uploads/${token}`)
    .set(CSRF_HEADER, CSRF_HEADER_VALUE)
    .attach("file", Buffer.from(bytes), name);

async function filesNamedBy(dir: string, sha256: string): Promise<number> {
  const entries = await readdir(dir, { withFileTypes: true, recursive: true }).catch(() => []);
  return entries.filter((e) => e.isFile() && e.name.includes(sha256)).length;
}

describe("certificates straight from the broker", () => {
  it("mails the broker a one-time link; the upload lands in the company's documents and the second use is refused", async () => {
    const provider = await buildProvider(t.app);
    const brokerEmail = await recordBroker(provider);
    const coverage = await submitLiabilityCertificate(provider.admin, 61);

    const sent = await provider.admin.post("/api/broker-requests").send({ credentialId: coverage.id });
    const token = await tokenMailedTo(brokerEmail);
    const page = await anonymous().get(`/api/broker-uploads/${token}`).set(CSRF_HEADER, CSRF_HEADER_VALUE);
    const { bytes } = await buildCertificatePdf({ seed: 62 });
    const first = await upload(token, bytes, "renewal.pdf");
    const second = await upload(token, bytes, "renewal.pdf");
    const row = await BrokerUploadRequest.findByPk(sent.body.id);

    expect(sent.status).toBe(201);
    expect(sent.body.brokerEmail).toBe(brokerEmail);
    // Common practice for one-time links: 32 random bytes, and only a digest kept at rest.
    expect(Buffer.from(token, "base64url")).toHaveLength(32);
    expect(row!.tokenSha256).toBe(createHash("sha256").update(token).digest("hex"));
    expect(JSON.stringify(sent.body)).not.toContain(token);
    const message = mail.to(brokerEmail).at(-1)!;
    expect(message.html).toContain(`/broker-upload/${token}`);
    expect(page.status).toBe(200);
    expect(page.body.companyName).toBe(provider.company.name);
    expect(first.status).toBe(201);
    // RFC 9110 §15.5.11: 410 Gone, the link's resource is no longer available and will not be again.
    expect(second.status).toBe(410);
    expect(row!.documentId).not.toBeNull();
    const document = await Document.findByPk(row!.documentId!);
    expect(document!.companyId).toBe(provider.company.id);
    expect(document!.typeCode).toBe("general_liability");
    expect(document!.extractionMethod).toBe("pdf_text");
  });

  it("keeps exactly one of two uploads racing on the same link", async () => {
    const provider = await buildProvider(t.app);
    const brokerEmail = await recordBroker(provider);
    await provider.admin.post("/api/broker-requests").send({ typeCode: "general_liability" }).expect(201);
    const token = await tokenMailedTo(brokerEmail);
    const [a, b] = await Promise.all([buildCertificatePdf({ seed: 69 }), buildCertificatePdf({ seed: 70 })]);

    const answers = await Promise.all([upload(token, a.bytes, "a.pdf"), upload(token, b.bytes, "b.pdf")]);

    expect(answers.map((r) => r.status).sort()).toEqual([201, 410]);
    expect(await Document.count({ where: { companyId: provider.company.id } })).toBe(1);
  });

  it("refuses an expired link with 410 and an unknown one with a bare 404", async () => {
    const provider = await buildProvider(t.app);
    const brokerEmail = await recordBroker(provider);
    const sent = await provider.admin.post("/api/broker-requests").send({ typeCode: "general_liability" });
    const token = await tokenMailedTo(brokerEmail);
    await BrokerUploadRequest.update(
      { expiresAt: new Date(Date.now() - 1000) },
      { where: { id: sent.body.id } },
    );
    const { bytes } = await buildCertificatePdf({ seed: 63 });

    const expired = await upload(token, bytes, "late.pdf");
    const unknown = await upload("A".repeat(43), bytes, "guess.pdf");
    const malformed = await anonymous()
      .get("/api/broker-uploads/not%00a%20token")
      .set(CSRF_HEADER, CSRF_HEADER_VALUE);

    expect(expired.status).toBe(410);
    expect(unknown.status).toBe(404);
    expect(malformed.status).toBe(404);
    expect(unknown.body.error.message).toBe(malformed.body.error.message);
    expect(await Document.count({ where: { companyId: provider.company.id } })).toBe(0);
  });

  it("answers 404 to a company asking a broker about another company's coverage", async () => {
    const owner = await buildProvider(t.app);
    const outsider = await buildProvider(t.app);
    await recordBroker(outsider);
    const coverage = await submitLiabilityCertificate(owner.admin, 64);

    const res = await outsider.admin.post("/api/broker-requests").send({ credentialId: coverage.id });

    expect(res.status).toBe(404);
    expect(await BrokerUploadRequest.count({ where: { companyId: outsider.company.id } })).toBe(0);
  });

  it("sends a coverage with its own broker to that broker and the others to the company's", async () => {
    const provider = await buildProvider(t.app);
    const companyBroker = await recordBroker(provider);
    const autoBroker = `auto-${provider.company.id}@fleet-cover.example.test`;
    await provider.admin
      .put("/api/broker-contacts")
      .send({
        typeCode: "auto_liability",
        agency: "Fleetwise Cover",
        contactName: "Ines Varga",
        email: autoBroker,
      })
      .expect(200);
    const noBroker = await buildProvider(t.app);

    const auto = await provider.admin.post("/api/broker-requests").send({ typeCode: "auto_liability" });
    const general = await provider.admin.post("/api/broker-requests").send({ typeCode: "general_liability" });
    const none = await noBroker.admin.post("/api/broker-requests").send({ typeCode: "general_liability" });
    const card = await provider.admin.post("/api/broker-requests").send({ typeCode: "osha_10" });
    const contacts = await provider.admin.get("/api/broker-contacts");

    expect(auto.body.brokerEmail).toBe(autoBroker);
    expect(general.body.brokerEmail).toBe(companyBroker);
    expect(none.status).toBe(422);
    expect(none.body.error.fields[0].path).toBe("broker");
    expect(card.status).toBe(422);
    expect(contacts.body).toHaveLength(2);
  });

  it("keeps no row and no file after a refused file type, and the link still works", async () => {
    const provider = await buildProvider(t.app);
    const brokerEmail = await recordBroker(provider);
    await provider.admin.post("/api/broker-requests").send({ typeCode: "general_liability" }).expect(201);
    const token = await tokenMailedTo(brokerEmail);
    // A PNG signature (ISO/IEC 15948 §5.2) followed by random bytes: a picture, not the PDF asked for.
    const png = Buffer.concat([
      Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
      Buffer.from(createHash("sha256").update(token).digest()),
    ]);
    const pngSha = createHash("sha256").update(png).digest("hex");
    const plain = Buffer.from(`just text ${token}`);

    const asPng = await upload(token, png, "certificate.png");
    const asText = await upload(token, plain, "certificate.pdf");
    // One byte over the 10 MB limit the documents page has.
    const tooLarge = await upload(token, Buffer.alloc(10 * 1024 * 1024 + 1, 0x25), "huge.pdf");
    const { bytes } = await buildCertificatePdf({ seed: 65 });
    const afterwards = await upload(token, bytes, "certificate.pdf");

    expect(asPng.status).toBe(415);
    expect(asText.status).toBe(415);
    expect(tooLarge.status).toBe(413);
    expect(asPng.body.error.fields[0].path).toBe("file");
    expect(await filesNamedBy(t.config.UPLOADS_DIR, pngSha)).toBe(0);
    expect(afterwards.status).toBe(201);
    expect(await Document.count({ where: { companyId: provider.company.id } })).toBe(1);
  });

  it("tells the shop named as certificate holder once the broker's certificate is verified", async () => {
    const provider = await buildProvider(t.app);
    const brokerEmail = await recordBroker(provider);
    const shop = await signedInAgent(t.app, "shop", "buyer");
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");
    await provider.admin
      .post("/api/broker-requests")
      .send({ typeCode: "general_liability", shopCompanyId: shop.company.id })
      .expect(201);
    const token = await tokenMailedTo(brokerEmail);
    expect(mail.to(brokerEmail).at(-1)!.text).toContain(shop.company.name);
    const { bytes, values } = await buildCertificatePdf({ seed: 66 });
    await upload(token, bytes, "holder.pdf").expect(201);
    const document = await Document.findOne({ where: { companyId: provider.company.id } });

    const submitted = await provider.admin.post("/api/credentials").send({
      documentId: document!.id,
      typeCode: "general_liability",
      fields: certificateFields(values, "general_liability"),
    });
    const before = await Notification.count({ where: { userId: shop.user.id } });
    await reviewer.post(`/api/credentials/${submitted.body.id}/verify`).send({}).expect(200);
    await mail.deliver();

    expect(submitted.status).toBe(201);
    expect(before).toBe(0);
    expect(await Notification.count({ where: { userId: shop.user.id } })).toBe(1);
    expect(mail.to(shop.user.email).map((m) => m.subject)).toEqual([
      expect.stringContaining(provider.company.name),
    ]);
  });
});

describe("reminding the broker before the lapse", () => {
  it("sends one reminder per threshold with a fresh link, shown on the coverage's trail, and none once the certificate arrived", async () => {
    const provider = await buildProvider(t.app);
    const brokerEmail = await recordBroker(provider);
    const coverage = await submitLiabilityCertificate(provider.admin, 67);
    await provider.admin.post("/api/broker-requests").send({ credentialId: coverage.id }).expect(201);
    const firstToken = await tokenMailedTo(brokerEmail);
    const { Credential } = await import("../../../server/credentials/model.ts");
    // Set close to now so the request (sent now) precedes every reminder run below.
    const lapsesAt = new Date(Date.now() + 60 * 24 * 3600 * 1000);
    await Credential.update({ lapsesAt }, { where: { id: coverage.id } });
    const daysBefore = (days: number) => new Date(lapsesAt.getTime() - days * 24 * 3600 * 1000);

    const early = await remindBrokers(daysBefore(40), "http://clearbench.test");
    const at20 = await remindBrokers(daysBefore(20), "http://clearbench.test");
    const again = await remindBrokers(daysBefore(19), "http://clearbench.test");
    const at10 = await remindBrokers(daysBefore(10), "http://clearbench.test");
    const reminderToken = await tokenMailedTo(brokerEmail);
    const oldLink = await anonymous()
      .get(`/api/broker-uploads/${firstToken}`)
      .set(CSRF_HEADER, CSRF_HEADER_VALUE);
    const { bytes } = await buildCertificatePdf({ seed: 68 });
    await upload(reminderToken, bytes, "renewed.pdf").expect(201);
    const afterArrival = await remindBrokers(daysBefore(5), "http://clearbench.test");
    const trail = await provider.admin.get(`/api/credentials/${coverage.id}`);

    expect(early.reminded).toBe(0);
    // Thresholds of 30, 14 and 7 days before expiry are common practice for renewal chasers.
    expect(at20.reminded).toBe(1);
    expect(again.reminded).toBe(0);
    expect(at10.reminded).toBe(1);
    expect(mail.to(brokerEmail).filter((m) => m.subject.startsWith("Reminder"))).toHaveLength(2);
    expect(reminderToken).not.toBe(firstToken);
    expect(oldLink.status).toBe(404);
    expect(afterArrival.reminded).toBe(0);
    expect(trail.body.audit.map((a: { action: string }) => a.action)).toEqual(
      expect.arrayContaining(["broker_request.sent", "broker_request.reminded"]),
    );
  });
});
