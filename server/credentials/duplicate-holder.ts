import { Credential, Document } from "./model.ts";

/** The same bytes already sit on a credential of a different holder (a copied card or certificate). */
export async function duplicateForOtherHolder(
  sha256: string,
  documentId: number,
  companyId: number,
  technicianId: number | null,
): Promise<boolean> {
  const others = await Document.findAll({ where: { sha256 }, attributes: ["id"] });
  const ids = others.map((d) => d.id).filter((id) => id !== documentId);
  if (ids.length === 0) return false;
  const credentials = await Credential.findAll({
    where: { documentId: ids },
    attributes: ["companyId", "technicianId"],
  });
  return credentials.some((c) => c.companyId !== companyId || c.technicianId !== technicianId);
}
