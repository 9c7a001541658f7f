import { Op, QueryTypes, type WhereOptions } from "sequelize";
import { credentialScopeWhere } from "./policy.ts";
import type { QueueQuery } from "../../shared/credentials/schemas.ts";
import { reviewerWarnings } from "../../shared/credentials/reviewer-checks.ts";
import { db } from "../db/sequelize.ts";
import { AppError } from "../http/app-error.ts";
import { auditTrail } from "../audit/index.ts";
import { Credential, CredentialType, Document } from "./model.ts";
import { toCredentialDto, toCredentialDtos } from "./dto.ts";
import { duplicateForOtherHolder } from "./duplicate-holder.ts";
import type { Evidence } from "../../shared/credentials/locate-values.ts";
import { workStatesOf } from "./work-states.ts";
import { fieldsForBuyers } from "../../shared/credentials/fields-for-buyers.ts";
import { Company, Technician, User } from "../db/models.ts";
import { previousVerifiedVersion } from "./previous-version.ts";
import type {
  CredentialDetailDto,
  PreviousVersionDto,
  QueuePageDto,
  ReviewerWarningDto,
} from "../../shared/credentials/credential-shapes.ts";

/** The caller's credentials: the shared read scope narrowed by the filters, never widened by them. */
export async function listOwnCredentials(
  user: Express.User,
  filter: { technicianId?: number; state?: string; holder?: "company" | "technician" },
) {
  const narrowed: WhereOptions[] = [credentialScopeWhere(user)];
  if (filter.technicianId) narrowed.push({ technicianId: filter.technicianId });
  if (filter.holder === "company") narrowed.push({ technicianId: null });
  if (filter.holder === "technician") narrowed.push({ technicianId: { [Op.ne]: null } });
  if (filter.state) narrowed.push({ state: filter.state });
  const rows = await Credential.findAll({
    where: { [Op.and]: narrowed },
    order: [["submittedAt", "DESC"]],
    limit: 500,
  });
  return toCredentialDtos(rows);
}

/** One credential with its audit trail; reviewers also get the warnings computed beside the fields. */
export async function findCredential(user: Express.User, id: number): Promise<CredentialDetailDto> {
  const row = await Credential.findByPk(id);
  if (!row) throw new AppError("not_found", "That credential was not found");
  const dto = await toCredentialDto(row);
  if (user.role === "buyer") {
    return {
      ...dto,
      fields: fieldsForBuyers(dto.fields),
      returnReason: null,
      audit: [],
      warnings: [],
      sameDocument: [],
      evidence: {},
      previousVersion: null,
    };
  }
  const events = await auditTrail("credential", id);
  const actors = await User.findAll({
    where: { id: [...new Set(events.flatMap((e) => (e.actorUserId ? [e.actorUserId] : [])))] },
    attributes: ["id", "name"],
  });
  const actorName = new Map(actors.map((a) => [a.id, a.name]));
  let warnings: ReviewerWarningDto[] = [];
  let evidence: Evidence = {};
  let previousVersion: PreviousVersionDto | null = null;
  if (user.role === "reviewer" || user.role === "admin") {
    previousVersion = await previousVerifiedVersion(row);
    const [type, company, technician, document] = await Promise.all([
      CredentialType.findByPk(row.typeCode),
      Company.findByPk(row.companyId),
      row.technicianId ? Technician.findByPk(row.technicianId) : null,
      Document.findByPk(row.documentId, { attributes: ["id", "sha256", "extractionEvidence"] }),
    ]);
    evidence = document?.extractionEvidence?.[row.typeCode] ?? {};
    warnings = reviewerWarnings({
      fieldSet: type!.fieldSet,
      fields: row.fields as never,
      companyLegalName: company?.name ?? "",
      technicianName: technician?.name,
      duplicateOfOtherHolder: document
        ? await duplicateForOtherHolder(document.sha256, document.id, row.companyId, row.technicianId)
        : false,
      workStates: type!.fieldSet === "exemption" ? await workStatesOf(row.companyId) : [],
    });
  }
  return {
    ...dto,
    sameDocument: await credentialsOnDocument(row.documentId, row.companyId),
    evidence,
    audit: events.map((e) => ({
      id: e.id,
      action: e.action,
      actorName: e.actorUserId ? (actorName.get(e.actorUserId) ?? "") : "Clearbench",
      at: e.createdAt.toISOString(),
      before: e.before,
      after: e.after,
    })),
    warnings,
    previousVersion,
  };
}

/**
 * Every credential sent from the same uploaded file (the coverages of one certificate), so the reviewer reads the
 * document once and decides each coverage on its own. Rows of the same company only.
 */
async function credentialsOnDocument(documentId: number, companyId: number) {
  const rows = await Credential.findAll({
    where: { documentId, companyId },
    attributes: ["id", "typeCode", "state"],
    order: [["id", "ASC"]],
  });
  const types = await CredentialType.findAll({
    where: { code: [...new Set(rows.map((r) => r.typeCode))] },
    attributes: ["code", "name"],
  });
  const name = new Map(types.map((t) => [t.code, t.name]));
  return rows.map((r) => ({
    id: r.id,
    typeCode: r.typeCode,
    typeName: name.get(r.typeCode) ?? r.typeCode,
    state: r.state,
  }));
}

const SORT_SQL: Record<QueueQuery["sort"], string> = {
  submittedAt: "c.submitted_at",
  typeCode: "t.name",
  companyName: "co.name",
};

/** The reviewers' queue: submitted credentials, filtered, sorted and paged in SQL (oldest first by default). */
export async function findQueue(q: QueueQuery, now = new Date()): Promise<QueuePageDto> {
  const where = ["c.state = 'submitted'"];
  const replacements: Record<string, unknown> = { now, limit: q.pageSize, offset: (q.page - 1) * q.pageSize };
  if (q.typeCode) {
    where.push("c.type_code = :typeCode");
    replacements.typeCode = q.typeCode;
  }
  if (q.companyId) {
    where.push("c.company_id = :companyId");
    replacements.companyId = q.companyId;
  }
  if (q.minWaitingHours !== undefined) {
    where.push("c.submitted_at <= :cutoff");
    replacements.cutoff = new Date(now.getTime() - q.minWaitingHours * 3_600_000);
  }
  const from = `FROM credentials c JOIN credential_types t ON t.code = c.type_code JOIN companies co ON co.id = c.company_id
    LEFT JOIN technicians tech ON tech.id = c.technician_id WHERE ${where.join(" AND ")}`;
  const order = `${SORT_SQL[q.sort]} ${q.dir === "desc" ? "DESC" : "ASC"}, c.id ASC`;
  // One statement: the page and the count (the count without the joins: every credential has its type and company,
  // foreign keys, not null, so it is read from credentials_queue_cover_idx alone). The count row is kept by the LEFT
  // JOIN when the page is past the end.
  const found = await db().query<{
    total: number;
    id: number | null;
    type_code: string;
    type_name: string;
    company_id: number;
    company_name: string;
    holder_name: string;
    submitted_at: Date;
  }>(
    `WITH page AS (
       SELECT c.id, c.type_code, t.name AS type_name, c.company_id, co.name AS company_name,
              COALESCE(tech.name, co.name) AS holder_name, c.submitted_at,
              row_number() OVER (ORDER BY ${order}) AS position
         ${from} ORDER BY ${order} LIMIT :limit OFFSET :offset)
     SELECT n.total, page.* FROM (SELECT count(*)::int AS total FROM credentials c WHERE ${where.join(" AND ")}) n
       LEFT JOIN page ON true
      ORDER BY page.position`,
    { replacements, type: QueryTypes.SELECT },
  );
  const rows = found.filter((r): r is (typeof found)[number] & { id: number } => r.id !== null);
  const totals = found.slice(0, 1);
  return {
    rows: rows.map((r) => ({
      id: r.id,
      typeCode: r.type_code,
      typeName: r.type_name,
      companyId: r.company_id,
      companyName: r.company_name,
      holderName: r.holder_name,
      submittedAt: new Date(r.submitted_at).toISOString(),
      waitingHours: Math.max(0, Math.floor((now.getTime() - new Date(r.submitted_at).getTime()) / 3_600_000)),
    })),
    total: totals[0]?.total ?? 0,
    page: q.page,
    pageSize: q.pageSize,
  };
}
