import { createHash, randomBytes } from "node:crypto";
import { Op, type Transaction } from "sequelize";
import {
  BROKER_LINK_DAYS,
  brokerLinkState,
  holderRoleLabels,
  type BrokerRequestOrigin,
  type HolderRole,
  type BrokerContactDto,
  type BrokerRequestDto,
  type BrokerUploadPageDto,
  type RequestBrokerCertificate,
  type SaveBrokerContact,
} from "../../shared/credentials/broker-schemas.ts";
import { AppError, notFound } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { enqueueMail } from "../mail/index.ts";
import { tellPerson } from "../notices/index.ts";
import type { FileStorage } from "../storage/index.ts";
import { Credential, CredentialType } from "./model.ts";
import { BrokerContact, BrokerRequestReminder, BrokerUploadRequest } from "./broker-model.ts";
import { brokerRequestMail, shopCertificateMail } from "./broker-emails.ts";
import { uploadDocument, type UploadedFile } from "./upload-document.ts";
import { Company, User } from "../db/models.ts";

const DAY_MS = 24 * 60 * 60 * 1000;
/** The shop's list of certificates it asked for (the client's route of the same path). */
export const SHOP_REQUESTS_PAGE = "/certificate-requests";

export const digestOf = (token: string) => createHash("sha256").update(token).digest("hex");

export const brokerLinkUrl = (linkBase: string, token: string) => `${linkBase}/broker-upload/${token}`;

export function formatDay(at: Date, timeZone: string): string {
  return new Intl.DateTimeFormat("en-US", { dateStyle: "long", timeZone }).format(at);
}

function toContactDto(c: BrokerContact): BrokerContactDto {
  return { id: c.id, typeCode: c.typeCode, agency: c.agency, contactName: c.contactName, email: c.email };
}

/** The office's view of its requests, with the coverage and shop by name and each reminder sent on the link. */
export async function toRequestDtos(
  rows: BrokerUploadRequest[],
  asOf = new Date(),
): Promise<BrokerRequestDto[]> {
  if (rows.length === 0) return [];
  const [types, shops, reminders] = await Promise.all([
    CredentialType.findAll({
      where: { code: [...new Set(rows.map((r) => r.typeCode))] },
      attributes: ["code", "name"],
    }),
    Company.findAll({
      where: { id: [...new Set(rows.flatMap((r) => (r.shopCompanyId ? [r.shopCompanyId] : [])))] },
      attributes: ["id", "name"],
    }),
    BrokerRequestReminder.findAll({
      where: { requestId: rows.map((r) => r.id) },
      order: [["sentAt", "ASC"]],
    }),
  ]);
  const typeName = new Map(types.map((t) => [t.code, t.name]));
  const shopName = new Map(shops.map((c) => [c.id, c.name]));
  return rows.map((r) => ({
    id: r.id,
    typeCode: r.typeCode,
    credentialId: r.credentialId,
    shopCompanyId: r.shopCompanyId,
    agency: r.agency,
    contactName: r.contactName,
    brokerEmail: r.brokerEmail,
    expiresAt: r.expiresAt.toISOString(),
    usedAt: r.usedAt?.toISOString() ?? null,
    documentId: r.documentId,
    createdAt: r.createdAt.toISOString(),
    coverageName: typeName.get(r.typeCode) ?? r.typeCode,
    holderRole: r.holderRole,
    origin: r.origin,
    shopName: r.shopCompanyId ? (shopName.get(r.shopCompanyId) ?? null) : null,
    linkState: brokerLinkState(r, asOf),
    reminders: reminders
      .filter((m) => m.requestId === r.id)
      .map((m) => ({ daysBefore: m.daysBefore, sentAt: m.sentAt.toISOString() })),
  }));
}

export async function listBrokerContacts(user: Express.User): Promise<BrokerContactDto[]> {
  const rows = await BrokerContact.findAll({ where: { companyId: user.companyId }, order: [["id", "ASC"]] });
  return rows.map(toContactDto);
}

export async function insuranceType(code: string): Promise<CredentialType> {
  const type = await CredentialType.findByPk(code);
  if (!type || !type.active || type.fieldSet !== "insurance" || type.holder !== "company")
    throw new AppError("invalid_input", "Choose a coverage held by the company", [
      { path: "body.typeCode", message: "not an insurance coverage" },
    ]);
  return type;
}

/** One broker for the company, and optionally another for one coverage; saving again replaces it. */
export async function saveBrokerContact(
  user: Express.User,
  input: SaveBrokerContact,
): Promise<BrokerContactDto> {
  const typeCode = input.typeCode ?? null;
  if (typeCode) await insuranceType(typeCode);
  return db().transaction(async (transaction) => {
    const existing = await BrokerContact.findOne({
      where: { companyId: user.companyId, typeCode },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    const values = { agency: input.agency, contactName: input.contactName, email: input.email };
    const row = existing
      ? await existing.update(values, { transaction })
      : await BrokerContact.create({ companyId: user.companyId, typeCode, ...values }, { transaction });
    await recordAudit(
      {
        actorUserId: user.id,
        action: "broker_contact.saved",
        subjectType: "broker_contact",
        subjectId: row.id,
        after: { typeCode, agency: input.agency },
      },
      transaction,
    );
    return toContactDto(row);
  });
}

/** Drops a coverage's own broker, so its requests go to the company's broker again. */
export async function removeCoverageBroker(user: Express.User, typeCode: string): Promise<void> {
  await db().transaction(async (transaction) => {
    const row = await BrokerContact.findOne({ where: { companyId: user.companyId, typeCode }, transaction });
    if (!row) throw notFound("That coverage's broker");
    await row.destroy({ transaction });
    await recordAudit(
      {
        actorUserId: user.id,
        action: "broker_contact.removed",
        subjectType: "broker_contact",
        subjectId: row.id,
        after: { typeCode },
      },
      transaction,
    );
  });
}

/** The coverage's own broker when one is recorded, else the company's. */
export async function brokerFor(companyId: number, typeCode: string): Promise<BrokerContact> {
  const rows = await BrokerContact.findAll({
    where: { companyId, typeCode: { [Op.or]: [typeCode, null] } },
  });
  const broker = rows.find((r) => r.typeCode === typeCode) ?? rows.find((r) => r.typeCode === null);
  if (!broker)
    throw new AppError("invalid_input", "Record the company's insurance broker before sending a request", [
      { path: "broker", message: "no broker on file" },
    ]);
  return broker;
}

/**
 * Creates a one-time upload link for the broker and queues the e-mail that carries it. The token itself is only in the
 * e-mail; the table keeps its SHA-256, so reading the database does not yield a working link.
 */
export async function requestBrokerCertificate(
  user: Express.User,
  input: RequestBrokerCertificate,
  linkBase: string,
): Promise<BrokerRequestDto> {
  let typeCode = input.typeCode;
  if (input.credentialId !== undefined) {
    // Scoped by the caller's company: another company's coverage answers like a missing one.
    const credential = await Credential.findOne({
      where: { id: input.credentialId, companyId: user.companyId, technicianId: null },
    });
    if (!credential) throw notFound("That coverage");
    if (typeCode && typeCode !== credential.typeCode)
      throw new AppError("invalid_input", "The type does not match the coverage", [
        { path: "body.typeCode", message: "differs from the coverage's type" },
      ]);
    typeCode = credential.typeCode;
  }
  const type = await insuranceType(typeCode!);
  const shop =
    input.shopCompanyId !== undefined
      ? await Company.findOne({ where: { id: input.shopCompanyId, kind: "shop" } })
      : null;
  if (input.shopCompanyId !== undefined && !shop) throw notFound("That shop");
  const [broker, company] = await Promise.all([
    brokerFor(user.companyId, type.code),
    Company.findByPk(user.companyId),
  ]);

  const row = await db().transaction((transaction) =>
    sendBrokerLink(
      {
        company: company!,
        type,
        broker,
        credentialId: input.credentialId ?? null,
        shop,
        holderRole: input.holderRole ?? "certificate_holder",
        origin: "office",
        requestedBy: user.id,
      },
      linkBase,
      transaction,
    ),
  );
  const [dto] = await toRequestDtos([row]);
  return dto!;
}

export interface BrokerLinkFacts {
  company: Company;
  type: CredentialType;
  broker: BrokerContact;
  credentialId: number | null;
  shop: Company | null;
  holderRole: HolderRole;
  origin: BrokerRequestOrigin;
  requestedBy: number;
}

/**
 * Creates a one-time upload link for the broker and queues the e-mail that carries it, in the caller's transaction.
 * The token itself is only in the e-mail; the table keeps its SHA-256, so reading the database does not yield a
 * working link.
 */
export async function sendBrokerLink(
  f: BrokerLinkFacts,
  linkBase: string,
  transaction: Transaction,
): Promise<BrokerUploadRequest> {
  const token = randomBytes(32).toString("base64url");
  const expiresAt = new Date(Date.now() + BROKER_LINK_DAYS * DAY_MS);
  const created = await BrokerUploadRequest.create(
    {
      companyId: f.company.id,
      typeCode: f.type.code,
      credentialId: f.credentialId,
      shopCompanyId: f.shop?.id ?? null,
      agency: f.broker.agency,
      contactName: f.broker.contactName,
      brokerEmail: f.broker.email,
      tokenSha256: digestOf(token),
      expiresAt,
      requestedBy: f.requestedBy,
      holderRole: f.holderRole,
      origin: f.origin,
    },
    { transaction },
  );
  await recordAudit(
    {
      actorUserId: f.requestedBy,
      action: "broker_request.sent",
      subjectType: "broker_upload_request",
      subjectId: created.id,
      after: {
        typeCode: f.type.code,
        credentialId: created.credentialId,
        shopCompanyId: created.shopCompanyId,
        holderRole: f.holderRole,
        origin: f.origin,
      },
    },
    transaction,
  );
  if (created.credentialId !== null)
    await recordAudit(
      {
        actorUserId: f.requestedBy,
        action: "broker_request.sent",
        subjectType: "credential",
        subjectId: created.credentialId,
        after: { requestId: created.id, brokerEmail: f.broker.email },
      },
      transaction,
    );
  await enqueueMail(
    brokerRequestMail({
      to: f.broker.email,
      contactName: f.broker.contactName,
      companyName: f.company.name,
      coverageName: f.type.name,
      certificateHolder: f.shop?.name ?? null,
      holderRole: f.holderRole,
      expiresAt: formatDay(expiresAt, f.company.timeZone),
      link: brokerLinkUrl(linkBase, token),
    }),
    transaction,
  );
  return created;
}

export async function listBrokerRequests(user: Express.User): Promise<BrokerRequestDto[]> {
  const rows = await BrokerUploadRequest.findAll({
    where: { companyId: user.companyId },
    order: [["id", "DESC"]],
    limit: 100,
  });
  return toRequestDtos(rows);
}

// The same answer for a token we never made and one of another kind: nothing to tell a guesser.
const unknownLink = () => new AppError("not_found", "This link was not found");
const spentLink = () =>
  new AppError("gone", "This upload link was already used; ask the company for a new one");
const expiredLink = () => new AppError("gone", "This upload link has expired; ask the company for a new one");

/** The request a token opens, refused when it is used or past its expiry. */
export async function openBrokerRequest(token: string, now = new Date()): Promise<BrokerUploadRequest> {
  const row = await BrokerUploadRequest.findOne({ where: { tokenSha256: digestOf(token) } });
  if (!row) throw unknownLink();
  if (row.usedAt) throw spentLink();
  if (row.expiresAt <= now) throw expiredLink();
  return row;
}

export async function showBrokerUpload(token: string): Promise<BrokerUploadPageDto> {
  const row = await openBrokerRequest(token);
  const [company, type, shop] = await Promise.all([
    Company.findByPk(row.companyId),
    CredentialType.findByPk(row.typeCode),
    row.shopCompanyId ? Company.findByPk(row.shopCompanyId) : null,
  ]);
  return {
    companyName: company!.name,
    coverageName: type!.name,
    certificateHolder: shop?.name ?? null,
    holderRole: row.holderRole,
    expiresAt: row.expiresAt.toISOString(),
  };
}

/**
 * The broker's one upload: the same pipeline as the office's own (type from the bytes, size, hash, reading), stored in
 * the company's documents on behalf of whoever sent the request. The link is spent in the document's own transaction,
 * so a refused file leaves the link usable and two uploads racing keep only one.
 */
export async function receiveBrokerUpload(
  token: string,
  file: UploadedFile | undefined,
  storage: FileStorage,
) {
  const request = await openBrokerRequest(token);
  const requester = await uploaderFor(request);
  if (!requester) throw unknownLink();
  const onBehalfOf: Express.User = {
    id: requester.id,
    email: requester.email,
    name: requester.name,
    role: requester.role,
    companyId: requester.companyId,
    technicianId: null,
  };
  const result = await uploadDocument(onBehalfOf, { typeCode: request.typeCode }, file, storage, {
    acceptOnly: ["application/pdf"],
    inTransaction: (document, transaction) => spendLink(request.id, document.id, transaction),
    // The file never reached storage: the link is the broker's to use again.
    onDiscard: async (document) => {
      await BrokerUploadRequest.update(
        { usedAt: null, documentId: null },
        { where: { id: request.id, documentId: document.id } },
      );
    },
  });
  return {
    received: true as const,
    document: { name: result.document.name, sizeBytes: result.document.sizeBytes },
  };
}

/**
 * Whose upload the broker's file counts as: the office user who asked, or for a shop's request the company's first
 * office admin, since the document belongs to the company and never to the shop that asked.
 */
async function uploaderFor(request: BrokerUploadRequest): Promise<User | null> {
  if (request.origin === "shop")
    return User.findOne({
      where: { companyId: request.companyId, role: "provider_admin" },
      order: [["id", "ASC"]],
    });
  const requester = await User.findByPk(request.requestedBy);
  return requester && requester.companyId === request.companyId ? requester : null;
}

async function spendLink(requestId: number, documentId: number, transaction: Transaction) {
  const now = new Date();
  const [count] = await BrokerUploadRequest.update(
    { usedAt: now, documentId },
    { where: { id: requestId, usedAt: null, expiresAt: { [Op.gt]: now } }, transaction },
  );
  if (count === 0) throw spentLink();
  await recordAudit(
    {
      actorUserId: null,
      action: "broker_request.fulfilled",
      subjectType: "broker_upload_request",
      subjectId: requestId,
      after: { documentId },
    },
    transaction,
  );
}

/**
 * Tells the shop named on a broker request that the certificate from it is verified: a notification for each of its
 * buyers and one e-mail each, once per request.
 */
export async function tellShopOfVerifiedCertificate(
  credential: Credential,
  linkBase: string,
  transaction: Transaction,
): Promise<void> {
  const requests = await BrokerUploadRequest.findAll({
    where: { documentId: credential.documentId, shopCompanyId: { [Op.ne]: null }, shopToldAt: null },
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
  for (const request of requests) {
    // In turn: the transaction's one connection runs one statement at a time.
    const company = await Company.findByPk(request.companyId, { transaction });
    const type = await CredentialType.findByPk(credential.typeCode, { transaction });
    const buyers = await User.findAll({
      where: { companyId: request.shopCompanyId!, role: "buyer" },
      transaction,
    });
    for (const buyer of buyers) {
      await tellPerson(
        shopCertificateMail(
          buyer.email,
          company!.name,
          type!.name,
          `${linkBase}${SHOP_REQUESTS_PAGE}`,
          request.holderRole,
        ),
        {
          kind: "broker_certificate_verified",
          title: `${company!.name}: ${type!.name} certificate verified`,
          body: `The certificate naming your shop as ${holderRoleLabels[request.holderRole as HolderRole].toLowerCase()} came from ${company!.name}'s broker and was verified.`,
          link: SHOP_REQUESTS_PAGE,
        },
        transaction,
      );
    }
    await request.update({ shopToldAt: new Date() }, { transaction });
  }
}
