import type { Response } from "express";
import type { Transaction } from "sequelize";
import type { RequestMessageDto } from "../../shared/service-requests/schemas.ts";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { Document } from "../credentials/index.ts";
import type { FileStorage } from "../storage/index.ts";
import { checkAttachment, sendAttachment, type UploadedFile } from "../work-orders/attachment-file.ts";
import { sniffRequestAttachment } from "./attachment-type.ts";
import { tellCompany, tellShop } from "./notify.ts";
import { findInvitation, findRequest, loadRequestForSide, requestLink } from "./records.ts";
import { insertReturningId, select, selectOne } from "./sql.ts";

/**
 * Stores a checked file and its document row in one transaction, the same way as work-order attachments: the type is
 * read from the bytes (photos, PDFs, .xlsx and .csv here), and the file moves into the store as the last step, taken out again if the commit fails.
 */
async function storeWithRow<T>(
  user: Express.User,
  file: UploadedFile,
  storage: FileStorage,
  write: (documentId: number, transaction: Transaction) => Promise<T>,
): Promise<T> {
  const attachment = await checkAttachment(file, sniffRequestAttachment);
  const hadFile = await storage.exists(attachment.sha256);
  let stored = false;
  try {
    return await db().transaction(async (transaction) => {
      const document = await Document.create(
        {
          companyId: user.companyId,
          uploadedBy: user.id,
          sha256: attachment.sha256,
          sizeBytes: attachment.sizeBytes,
          mime: attachment.mime,
          originalName: attachment.name,
          extractedText: null,
          extractionMethod: "none",
        },
        { transaction },
      );
      const result = await write(document.id, transaction);
      await storage.commit(attachment.tempPath, attachment.sha256);
      stored = true;
      return result;
    });
  } catch (err) {
    if (stored && !hadFile) await storage.remove(attachment.sha256);
    throw err;
  }
}

export async function addRequestAttachment(
  buyer: Express.User,
  requestId: number,
  file: UploadedFile | undefined,
  storage: FileStorage,
) {
  const request = await findRequest(requestId);
  if (!request || request.shop_company_id !== buyer.companyId)
    throw new AppError("not_found", "That service request was not found");
  if (request.status !== "open") throw new AppError("conflict", `This request is ${request.status}`);
  if (!file) throw new AppError("invalid_input", "Attach a file", [{ path: "file", message: "required" }]);
  const id = await storeWithRow(buyer, file, storage, async (documentId, transaction) => {
    const attachmentId = await insertReturningId(
      "INSERT INTO service_request_attachments (request_id, document_id) VALUES ($1, $2)",
      [requestId, documentId],
      transaction,
    );
    await recordAudit(
      {
        actorUserId: buyer.id,
        action: "service_request.attachment_added",
        subjectType: "service_request",
        subjectId: requestId,
        after: { documentId },
      },
      transaction,
    );
    return attachmentId;
  });
  return { id, url: `/api/service-requests/${requestId}/attachments/${id}` };
}

export async function sendRequestAttachment(
  user: Express.User,
  requestId: number,
  attachmentId: number,
  storage: FileStorage,
  res: Response,
) {
  await loadRequestForSide(user, requestId);
  const document = await selectOne<{ id: number; sha256: string; mime: string; original_name: string }>(
    `SELECT d.id, d.sha256, d.mime, d.original_name FROM service_request_attachments a JOIN documents d ON d.id = a.document_id
      WHERE a.id = $1 AND a.request_id = $2`,
    [attachmentId, requestId],
  );
  if (!document) throw new AppError("not_found", "That attachment was not found");
  await sendAttachment(res, storage, {
    sha256: document.sha256,
    mime: document.mime,
    originalName: document.original_name,
  });
}

/** The shop may read and write every company's thread; a company only its own. Anyone else: 404. */
async function threadAccess(user: Express.User, requestId: number, companyId: number) {
  const { row, side } = await loadRequestForSide(user, requestId);
  const invitation = await findInvitation(requestId, companyId);
  if (!invitation || side === "coordinator" || (side === "service" && companyId !== user.companyId))
    throw new AppError("not_found", "That thread was not found");
  return { row, side: side as "shop" | "service" };
}

export async function listThread(
  user: Express.User,
  requestId: number,
  companyId: number,
): Promise<RequestMessageDto[]> {
  await threadAccess(user, requestId, companyId);
  const rows = await select<{
    id: number;
    side: "shop" | "service";
    author: string;
    body: string;
    created_at: Date;
    original_name: string | null;
    mime: string | null;
    size_bytes: number | null;
    document_id: number | null;
  }>(
    `SELECT m.id, m.side, u.name AS author, m.body, m.created_at, m.document_id, d.original_name, d.mime, d.size_bytes
       FROM service_request_messages m JOIN users u ON u.id = m.author_user_id LEFT JOIN documents d ON d.id = m.document_id
      WHERE m.request_id = $1 AND m.company_id = $2 ORDER BY m.id`,
    [requestId, companyId],
  );
  return rows.map((r) => ({
    id: r.id,
    side: r.side,
    author: r.author,
    body: r.body,
    attachment: r.document_id
      ? {
          name: r.original_name!,
          mime: r.mime!,
          sizeBytes: r.size_bytes!,
          url: `/api/service-requests/${requestId}/threads/${companyId}/messages/${r.id}/file`,
        }
      : null,
    createdAt: new Date(r.created_at).toISOString(),
  }));
}

/** Appends a message; the thread is read-only once the request is decided, cancelled or expired (409). */
export async function postThreadMessage(
  user: Express.User,
  requestId: number,
  companyId: number,
  body: string,
  file: UploadedFile | undefined,
  storage: FileStorage,
  linkBase: string,
) {
  const { row, side } = await threadAccess(user, requestId, companyId);
  if (row.status !== "open")
    throw new AppError("conflict", `This request is ${row.status}; its threads are kept read-only`);
  const write = async (documentId: number | null, transaction: Transaction) => {
    const id = await insertReturningId(
      `INSERT INTO service_request_messages (request_id, company_id, author_user_id, side, body, document_id)
       VALUES ($1, $2, $3, $4, $5, $6)`,
      [requestId, companyId, user.id, side, body, documentId],
      transaction,
    );
    const news = {
      kind: "service_request.message",
      title: `Service request #${requestId}: message from ${user.name}`,
      lines: [`${user.name} wrote:`, body],
    };
    if (side === "shop")
      await tellCompany(
        companyId,
        { ...news, link: requestLink(linkBase, requestId, "service") },
        transaction,
      );
    else await tellShop(row, { ...news, link: requestLink(linkBase, requestId, "shop") }, transaction);
    return id;
  };
  const id = file
    ? await storeWithRow(user, file, storage, write)
    : await db().transaction((t) => write(null, t));
  return (await listThread(user, requestId, companyId)).find((m) => m.id === id)!;
}

export async function sendThreadFile(
  user: Express.User,
  requestId: number,
  companyId: number,
  messageId: number,
  storage: FileStorage,
  res: Response,
) {
  await threadAccess(user, requestId, companyId);
  const document = await selectOne<{ sha256: string; mime: string; original_name: string }>(
    `SELECT d.sha256, d.mime, d.original_name FROM service_request_messages m JOIN documents d ON d.id = m.document_id
      WHERE m.id = $1 AND m.request_id = $2 AND m.company_id = $3`,
    [messageId, requestId, companyId],
  );
  if (!document) throw new AppError("not_found", "That attachment was not found");
  await sendAttachment(res, storage, {
    sha256: document.sha256,
    mime: document.mime,
    originalName: document.original_name,
  });
}
