import { QueryTypes } from "sequelize";
import {
  documentAccess,
  type DocumentAccess,
  type DocumentFacts,
} from "../../shared/credentials/read-rules.ts";
import type { CredentialCategory } from "../../shared/credentials/catalogue.ts";
import type { CredentialState } from "../../shared/credentials/schemas.ts";
import { db } from "../db/sequelize.ts";
import type { SignedInUser } from "../http/policy.ts";

interface FactsRow {
  company_id: number;
  uploaded_by: number;
  technician_id: number | null;
  work_order_id: number | null;
  shop_company_id: number | null;
  service_company_id: number | null;
  work_order_technician_id: number | null;
  credentials: {
    companyId: number;
    technicianId: number | null;
    state: CredentialState;
    category: CredentialCategory;
    submittedBy: number;
  }[];
}

/** The file and everything the shared read rule needs about it, in one statement. */
export async function loadDocumentFacts(documentId: number): Promise<DocumentFacts | null> {
  const [row] = await db().query<FactsRow>(
    `SELECT d.company_id, d.uploaded_by, d.technician_id, d.work_order_id,
            wo.shop_company_id, wo.service_company_id, wo.technician_id AS work_order_technician_id,
            COALESCE((SELECT json_agg(json_build_object('companyId', c.company_id, 'technicianId', c.technician_id,
                       'state', c.state, 'category', t.category, 'submittedBy', c.submitted_by))
                FROM credentials c JOIN credential_types t ON t.code = c.type_code WHERE c.document_id = d.id), '[]')
              AS credentials
       FROM documents d LEFT JOIN work_orders wo ON wo.id = d.work_order_id
      WHERE d.id = $1`,
    { bind: [documentId], type: QueryTypes.SELECT },
  );
  if (!row) return null;
  return {
    companyId: row.company_id,
    uploadedBy: row.uploaded_by,
    technicianId: row.technician_id,
    workOrder:
      row.work_order_id === null
        ? null
        : {
            shopCompanyId: row.shop_company_id!,
            serviceCompanyId: row.service_company_id!,
            technicianId: row.work_order_technician_id!,
          },
    credentials: row.credentials,
  };
}

/** What this user may do with the file; a missing file reads as "none", like another company's. */
export async function documentAccessFor(user: SignedInUser, documentId: number): Promise<DocumentAccess> {
  const facts = await loadDocumentFacts(documentId);
  return facts ? documentAccess(user, facts) : "none";
}
