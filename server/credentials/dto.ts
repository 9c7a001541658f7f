import type { CredentialDto } from "../../shared/credentials/schemas.ts";
import { Credential, CredentialType, Document } from "./model.ts";
import { Company, Technician } from "../db/models.ts";

/** Maps rows to the wire shape; storage keys and extracted text never leave the server. */
export async function toCredentialDtos(rows: Credential[]): Promise<CredentialDto[]> {
  if (rows.length === 0) return [];
  const [types, companies, technicians, documents] = await Promise.all([
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
  }));
}

export async function toCredentialDto(row: Credential): Promise<CredentialDto> {
  const [dto] = await toCredentialDtos([row]);
  return dto!;
}
