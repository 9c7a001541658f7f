import type { CredentialDto } from "../../shared/credentials/credential-shapes.ts";
import { awaitsHolder, type FollowUpCandidate } from "../../shared/credentials/credential-kind.ts";
import { Credential, CredentialType, Document } from "./model.ts";
import { Company, Technician } from "../db/models.ts";
import { reviewerWarnings, type ReviewerWarning } from "../../shared/credentials/reviewer-checks.ts";
import type { CertificateProposal } from "../../shared/credentials/extract-fields.ts";
import type { Evidence } from "../../shared/credentials/locate-values.ts";
import { duplicateForOtherHolder } from "./duplicate-holder.ts";
import type { UploadReading } from "./upload-reading.ts";
import { workStatesOf } from "./work-states.ts";

/** The company's credentials that could answer a returned or lapsed one among `rows` (none asked when none is). */
async function followUpCandidates(rows: Credential[]): Promise<FollowUpCandidate[]> {
  const waiting = rows.filter((r) => r.state === "returned" || r.state === "lapsed");
  if (waiting.length === 0) return [];
  return Credential.findAll({
    where: {
      companyId: [...new Set(waiting.map((r) => r.companyId))],
      typeCode: [...new Set(waiting.map((r) => r.typeCode))],
    },
    attributes: ["id", "typeCode", "companyId", "technicianId", "fields", "state", "submittedAt"],
  });
}

/** Maps rows to the wire shape; storage keys and extracted text never leave the server. */
export async function toCredentialDtos(rows: Credential[]): Promise<CredentialDto[]> {
  if (rows.length === 0) return [];
  const [types, companies, technicians, documents, candidates] = await Promise.all([
    CredentialType.findAll({ where: { code: [...new Set(rows.map((r) => r.typeCode))] } }),
    Company.findAll({
      where: { id: [...new Set(rows.map((r) => r.companyId))] },
      attributes: ["id", "name"],
    }),
    Technician.findAll({
      where: { id: [...new Set(rows.flatMap((r) => (r.technicianId ? [r.technicianId] : [])))] },
      attributes: ["id", "name"],
    }),
    Document.findAll({
      where: { id: [...new Set(rows.map((r) => r.documentId))] },
      attributes: ["id", "originalName", "mime"],
    }),
    followUpCandidates(rows),
  ]);
  const type = new Map(types.map((t) => [t.code, t]));
  const company = new Map(companies.map((c) => [c.id, c.name]));
  const technician = new Map(technicians.map((t) => [t.id, t.name]));
  const document = new Map(documents.map((d) => [d.id, d]));
  return rows.map((r) => ({
    id: r.id,
    typeCode: r.typeCode,
    typeName: type.get(r.typeCode)?.name ?? r.typeCode,
    category: type.get(r.typeCode)?.category ?? "insurance",
    holder: r.technicianId ? "technician" : "company",
    companyId: r.companyId,
    companyName: company.get(r.companyId) ?? "",
    technicianId: r.technicianId,
    technicianName: r.technicianId ? (technician.get(r.technicianId) ?? null) : null,
    documentId: r.documentId,
    documentName: document.get(r.documentId)?.originalName ?? "",
    documentMime: document.get(r.documentId)?.mime ?? "",
    state: r.state,
    fields: r.fields,
    returnReason: r.returnReason ?? null,
    submittedAt: r.submittedAt.toISOString(),
    decidedAt: r.decidedAt ? r.decidedAt.toISOString() : null,
    lapsesAt: r.lapsesAt ? r.lapsesAt.toISOString() : null,
    awaitsHolder: awaitsHolder(r, candidates),
  }));
}

export async function toCredentialDto(row: Credential): Promise<CredentialDto> {
  const [dto] = await toCredentialDtos([row]);
  return dto!;
}

interface UploadedDocumentParts {
  user: Express.User;
  type: CredentialType;
  technicianId: number | null;
  document: Document;
  reading: UploadReading;
}

/**
 * What the uploader sees after sending a file: the stored document, the fields read from it with where they were
 * found, the reviewer's warnings about them, and for a certificate every coverage it lists.
 */
export async function toUploadedDocumentDto({
  user,
  type,
  technicianId,
  document,
  reading,
}: UploadedDocumentParts) {
  const [company, technician, otherHolder] = await Promise.all([
    Company.findByPk(user.companyId),
    technicianId ? Technician.findByPk(technicianId) : null,
    duplicateForOtherHolder(document.sha256, document.id, user.companyId, technicianId),
  ]);
  const fields = reading.proposal?.fields ?? {};
  const workStates = type.fieldSet === "exemption" ? await workStatesOf(user.companyId) : [];
  const warningsFor = (proposed: object) =>
    reviewerWarnings({
      fieldSet: type.fieldSet,
      fields: proposed as never,
      companyLegalName: company?.name ?? "",
      technicianName: technician?.name,
      duplicateOfOtherHolder: otherHolder,
      workStates,
    });
  return {
    document: {
      id: document.id,
      name: document.originalName,
      mime: document.mime,
      sizeBytes: document.sizeBytes,
      sha256: document.sha256,
    },
    extraction: {
      method: reading.method,
      ocrAvailable: reading.ocrAvailable,
      fields,
      found: reading.proposal?.found ?? [],
      evidence: reading.evidence?.[type.code] ?? {},
    },
    warnings: warningsFor(fields),
    certificate: reading.certificate
      ? await certificateCoverages(reading.certificate, warningsFor, reading.evidence ?? {})
      : null,
  };
}

/**
 * Every coverage read from a certificate that the catalogue offers (an admin may retire a type), each with its own
 * proposed fields and warnings, so the uploader confirms all of them on one form.
 */
async function certificateCoverages(
  certificate: CertificateProposal,
  warningsFor: (fields: object) => ReviewerWarning[],
  evidence: Record<string, Evidence>,
) {
  const types = await CredentialType.findAll({
    where: { code: certificate.coverages.map((c) => c.typeCode), active: true, fieldSet: "insurance" },
  });
  const name = new Map(types.map((t) => [t.code, t.name]));
  return {
    parties: certificate.parties,
    coverages: certificate.coverages
      .filter((coverage) => name.has(coverage.typeCode))
      .map(({ typeCode, proposal }) => ({
        typeCode,
        typeName: name.get(typeCode) ?? typeCode,
        fields: proposal.fields,
        found: proposal.found,
        evidence: evidence[typeCode] ?? {},
        warnings: warningsFor(proposal.fields),
      })),
  };
}
