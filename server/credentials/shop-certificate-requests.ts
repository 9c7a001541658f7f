import { Op, QueryTypes } from "sequelize";
import {
  brokerLinkState,
  type AskForCertificate,
  type ShopCertificateRequestDto,
  type ShopCertificateRequestsDto,
} from "../../shared/credentials/broker-schemas.ts";
import { AppError, notFound } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { CredentialType } from "./model.ts";
import { BrokerUploadRequest } from "./broker-model.ts";
import { brokerFor, insuranceType, sendBrokerLink } from "./broker-requests.ts";
import { Company, User, Notification } from "../db/models.ts";

/**
 * The service companies a shop works with: on its roster (the company, or one of its technicians) or party to one of
 * its work orders. A shop may ask only these, so the platform does not become a way to mail any company's broker.
 */
async function companiesOfShop(shopCompanyId: number): Promise<{ id: number; name: string }[]> {
  return db().query<{ id: number; name: string }>(
    `SELECT c.id, c.name FROM companies c
      WHERE c.kind = 'service' AND (
        EXISTS (SELECT 1 FROM roster_entries r
                 WHERE r.shop_company_id = :shop
                   AND (r.service_company_id = c.id
                        OR r.technician_id IN (SELECT t.id FROM technicians t WHERE t.company_id = c.id)))
        OR EXISTS (SELECT 1 FROM work_orders w WHERE w.shop_company_id = :shop AND w.service_company_id = c.id))
      ORDER BY c.name, c.id`,
    { replacements: { shop: shopCompanyId }, type: QueryTypes.SELECT },
  );
}

/**
 * A shop asks a service company for a certificate naming it: the company's recorded broker for that coverage gets the
 * same one-time upload link the office would send, the company's office is told, and the shop is told again when the
 * certificate is verified. One open request per company and coverage, so asking twice does not mail the broker twice.
 */
export async function askForCertificate(
  user: Express.User,
  input: AskForCertificate,
  linkBase: string,
): Promise<ShopCertificateRequestDto> {
  const related = await companiesOfShop(user.companyId);
  if (!related.some((c) => c.id === input.serviceCompanyId)) throw notFound("That service company");
  const [company, shop, type] = await Promise.all([
    Company.findByPk(input.serviceCompanyId),
    Company.findByPk(user.companyId),
    insuranceType(input.typeCode),
  ]);
  if (!company || !shop) throw notFound("That service company");
  const broker = await brokerFor(company.id, type.code).catch((err: unknown) => {
    if (!(err instanceof AppError)) throw err;
    throw new AppError("invalid_input", `${company.name} has not recorded a broker for this coverage yet`, [
      { path: "body.typeCode", message: "no broker on file for this coverage" },
    ]);
  });

  const row = await db().transaction(async (transaction) => {
    // Serialises two asks racing for the same company and coverage.
    await db().query("SELECT pg_advisory_xact_lock(hashtext('shop-certificate-request'), :shop)", {
      replacements: { shop: user.companyId },
      transaction,
    });
    const open = await BrokerUploadRequest.findOne({
      where: {
        companyId: company.id,
        shopCompanyId: user.companyId,
        typeCode: type.code,
        usedAt: null,
        expiresAt: { [Op.gt]: new Date() },
      },
      transaction,
    });
    if (open)
      throw new AppError(
        "conflict",
        "You already asked for this certificate; the broker's link is still open",
        [{ path: "body.typeCode", message: "already asked" }],
      );
    const created = await sendBrokerLink(
      {
        company,
        type,
        broker,
        credentialId: null,
        shop,
        holderRole: input.holderRole,
        origin: "shop",
        requestedBy: user.id,
      },
      linkBase,
      transaction,
    );
    const admins = await User.findAll({
      where: { companyId: company.id, role: "provider_admin" },
      attributes: ["id"],
      transaction,
    });
    for (const admin of admins)
      await Notification.create(
        {
          userId: admin.id,
          kind: "broker_request_from_shop",
          title: `${shop.name} asked for a ${type.name} certificate`,
          body: `Your broker (${broker.agency}) was sent a one-time upload link for a certificate naming ${shop.name}. It arrives in your documents for you to submit.`,
          link: "/provider/brokers",
          noticeId: null,
        },
        { transaction },
      );
    return created;
  });
  const [dto] = toShopDtos([row], new Map([[company.id, company.name]]), new Map([[type.code, type.name]]));
  return dto!;
}

function toShopDtos(
  rows: BrokerUploadRequest[],
  companyName: Map<number, string>,
  typeName: Map<string, string>,
  asOf = new Date(),
): ShopCertificateRequestDto[] {
  return rows.map((r) => ({
    id: r.id,
    companyName: companyName.get(r.companyId) ?? "",
    coverageName: typeName.get(r.typeCode) ?? r.typeCode,
    holderRole: r.holderRole,
    linkState: brokerLinkState(r, asOf),
    createdAt: r.createdAt.toISOString(),
    expiresAt: r.expiresAt.toISOString(),
    receivedAt: r.usedAt?.toISOString() ?? null,
    verifiedAt: r.shopToldAt?.toISOString() ?? null,
  }));
}

/** Every request naming this shop (asked by it, or sent by a company's office for it), and whom it may ask. */
export async function listShopCertificateRequests(user: Express.User): Promise<ShopCertificateRequestsDto> {
  const [rows, companies, types] = await Promise.all([
    BrokerUploadRequest.findAll({
      where: { shopCompanyId: user.companyId },
      order: [["id", "DESC"]],
      limit: 100,
    }),
    companiesOfShop(user.companyId),
    CredentialType.findAll({
      where: { active: true, fieldSet: "insurance", holder: "company" },
      attributes: ["code", "name"],
      order: [["name", "ASC"]],
    }),
  ]);
  const names = await Company.findAll({
    where: { id: [...new Set(rows.map((r) => r.companyId))] },
    attributes: ["id", "name"],
  });
  return {
    requests: toShopDtos(
      rows,
      new Map(names.map((c) => [c.id, c.name])),
      new Map(types.map((t) => [t.code, t.name])),
    ),
    companies,
    coverages: types.map((t) => ({ code: t.code, name: t.name })),
  };
}
