import { Op } from "sequelize";
import type { BrokerCoverageDto } from "../../shared/credentials/broker-schemas.ts";
import { BrokerContact, BrokerUploadRequest } from "./broker-model.ts";
import { toRequestDtos } from "./broker-requests.ts";
import { Credential, CredentialType } from "./model.ts";

/** Requests shown per coverage; older ones stay on the coverage's audit trail. */
const REQUESTS_PER_COVERAGE = 10;

/**
 * The office's view of its insurance coverages and their brokers. Every query is scoped by the caller's company, so
 * the screen holds nothing of another company; a shop's request for this company shows here with the shop's name.
 */
export async function listBrokerCoverages(user: Express.User): Promise<BrokerCoverageDto[]> {
  const [types, contacts, credentials, requests] = await Promise.all([
    CredentialType.findAll({
      where: { active: true, fieldSet: "insurance", holder: "company" },
      order: [["name", "ASC"]],
    }),
    BrokerContact.findAll({ where: { companyId: user.companyId } }),
    Credential.findAll({
      where: { companyId: user.companyId, technicianId: null, state: { [Op.ne]: "superseded" } },
      attributes: ["id", "typeCode", "state", "lapsesAt", "submittedAt"],
      order: [
        ["submittedAt", "DESC"],
        ["id", "DESC"],
      ],
    }),
    BrokerUploadRequest.findAll({
      where: { companyId: user.companyId },
      order: [["id", "DESC"]],
      limit: 500,
    }),
  ]);
  const dtos = await toRequestDtos(requests);
  const companyBroker = contacts.find((c) => c.typeCode === null);
  return types.map((type) => {
    const own = contacts.find((c) => c.typeCode === type.code);
    const chosen = own ?? companyBroker;
    const latest = credentials.find((c) => c.typeCode === type.code);
    return {
      typeCode: type.code,
      coverageName: type.name,
      broker: chosen
        ? {
            source: own ? "coverage" : "company",
            agency: chosen.agency,
            contactName: chosen.contactName,
            email: chosen.email,
          }
        : null,
      coverage: latest
        ? { credentialId: latest.id, state: latest.state, lapsesAt: latest.lapsesAt?.toISOString() ?? null }
        : null,
      requests: dtos.filter((r) => r.typeCode === type.code).slice(0, REQUESTS_PER_COVERAGE),
    };
  });
}
