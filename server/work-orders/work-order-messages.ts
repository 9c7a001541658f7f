import type { WorkOrderMessageDto } from "../../shared/work-orders/schemas.ts";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { User } from "../accounts/index.ts";
import { Document } from "../credentials/index.ts";
import type { FileStorage } from "../storage/index.ts";
import { WorkOrderMessage } from "./model.ts";
import { loadForSide } from "./find-work-orders.ts";
import { checkAttachment, sendAttachment, type UploadedFile } from "./attachment-file.ts";
import { mailOtherSide } from "./work-order-emails.ts";
import { saveThumbnail, thumbnailJpeg, thumbnailSizes } from "./attachment-thumbnail.ts";
import type { Response } from "express";

async function toMessageDtos(rows: WorkOrderMessage[]): Promise<WorkOrderMessageDto[]> {
  const [authors, documents] = await Promise.all([
    User.findAll({
      where: { id: [...new Set(rows.map((r) => r.authorUserId))] },
      attributes: ["id", "name"],
    }),
    Document.findAll({
      where: { id: rows.flatMap((r) => (r.documentId ? [r.documentId] : [])) },
      attributes: ["id", "originalName", "mime", "sizeBytes"],
    }),
  ]);
  const author = new Map(authors.map((a) => [a.id, a.name]));
  const document = new Map(documents.map((d) => [d.id, d]));
  const thumbnails = await thumbnailSizes(documents.map((d) => d.id));
  return rows.map((r) => {
    const d = r.documentId ? document.get(r.documentId) : undefined;
    const thumbnail = d ? thumbnails.get(d.id) : undefined;
    const fileUrl = `/api/work-orders/${r.workOrderId}/messages/${r.id}/file`;
    return {
      id: r.id,
      workOrderId: r.workOrderId,
      author: { id: r.authorUserId, name: author.get(r.authorUserId) ?? "" },
      side: r.side,
      body: r.body,
      attachment: d
        ? {
            documentId: d.id,
            name: d.originalName,
            mime: d.mime,
            sizeBytes: d.sizeBytes,
            url: fileUrl,
            thumbnail: thumbnail
              ? { url: `/api/work-orders/${r.workOrderId}/messages/${r.id}/thumbnail`, ...thumbnail }
              : null,
          }
        : null,
      createdAt: r.createdAt.toISOString(),
    };
  });
}

export async function listMessages(user: Express.User, workOrderId: number) {
  await loadForSide(user, workOrderId);
  const rows = await WorkOrderMessage.findAll({ where: { workOrderId }, order: [["id", "ASC"]] });
  return toMessageDtos(rows);
}

/**
 * Appends a message, with an optional attachment owned by the sender's company. The thread is append-only, so a row
 * cannot be removed if the file fails to store: the file is moved into place as the transaction's last step instead,
 * and taken out again if the commit itself fails.
 */
export async function postMessage(
  user: Express.User,
  workOrderId: number,
  body: string,
  file: UploadedFile | undefined,
  storage: FileStorage,
  link: string,
) {
  const { row: workOrder, side } = await loadForSide(user, workOrderId);
  const attachment = file ? await checkAttachment(file) : undefined;
  const hadFile = attachment ? await storage.exists(attachment.sha256) : true;
  let stored = false;
  try {
    const message = await db().transaction(async (transaction) => {
      let documentId: number | null = null;
      if (attachment) {
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
            workOrderId,
          },
          { transaction },
        );
        await recordAudit(
          {
            actorUserId: user.id,
            action: "document.uploaded",
            subjectType: "document",
            subjectId: document.id,
            after: { sha256: attachment.sha256, mime: attachment.mime, workOrderId },
          },
          transaction,
        );
        documentId = document.id;
        if (attachment.thumbnail) await saveThumbnail(document.id, attachment.thumbnail, transaction);
      }
      const row = await WorkOrderMessage.create(
        { workOrderId, authorUserId: user.id, side, body, documentId },
        { transaction },
      );
      await recordAudit(
        {
          actorUserId: user.id,
          action: "work_order.message_posted",
          subjectType: "work_order",
          subjectId: workOrderId,
          after: { messageId: row.id, documentId },
        },
        transaction,
      );
      await mailOtherSide(
        workOrder,
        side === "shop" ? "service" : "shop",
        {
          subject: `message from ${user.name}`,
          lines: [`${user.name} wrote:`, body],
          next: { sentence: "Reply in the work order's messages.", label: "Reply" },
        },
        link,
        transaction,
      );
      if (attachment) {
        await storage.commit(attachment.tempPath, attachment.sha256);
        stored = true;
      }
      return row;
    });
    return (await toMessageDtos([message]))[0]!;
  } catch (err) {
    if (stored && attachment && !hadFile) await storage.remove(attachment.sha256);
    throw err;
  }
}

export async function sendMessageFile(
  user: Express.User,
  workOrderId: number,
  messageId: number,
  storage: FileStorage,
  res: Response,
) {
  await loadForSide(user, workOrderId);
  const message = await WorkOrderMessage.findOne({ where: { id: messageId, workOrderId } });
  const document = message?.documentId ? await Document.findByPk(message.documentId) : null;
  if (!document) throw new AppError("not_found", "That attachment was not found");
  await recordAudit({
    actorUserId: user.id,
    action: "document.downloaded",
    subjectType: "document",
    subjectId: document.id,
  });
  await sendAttachment(res, storage, document);
}

/**
 * The thumbnail of an image attachment, to the same two parties as the file. Not audited as a download: it is shown
 * each time the thread is read, and it is a reduced copy made by the server, not the file itself.
 */
export async function sendMessageThumbnail(
  user: Express.User,
  workOrderId: number,
  messageId: number,
  res: Response,
) {
  await loadForSide(user, workOrderId);
  const message = await WorkOrderMessage.findOne({ where: { id: messageId, workOrderId } });
  const jpeg = message?.documentId ? await thumbnailJpeg(message.documentId) : null;
  if (!jpeg) throw new AppError("not_found", "That thumbnail was not found");
  res.setHeader("Content-Type", "image/jpeg");
  res.setHeader("X-Content-Type-Options", "nosniff");
  res.setHeader("Content-Security-Policy", "default-src 'none'; sandbox");
  res.setHeader("Cache-Control", "private, max-age=3600");
  res.end(jpeg);
}
