import { mkdtemp, readFile, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import type { Response } from "express";
import { AppError } from "../http/app-error.ts";
import { contentDisposition } from "../http/file-names.ts";
import { recordAudit } from "../audit/index.ts";
import type { FileStorage } from "../storage/index.ts";
import { Document } from "./model.ts";
import { MAX_PREVIEW_PIXELS, pdfPageSizes, renderDpi, runBounded } from "./extraction/render-bounds.ts";
import { documentAccessFor } from "./document-access.ts";

const PREVIEW_DPI = 110;

const PAGE_RENDER_TIMEOUT_MS = 15_000;
const MAX_PREVIEW_PAGES = 10;

async function loadDocument(id: number) {
  const document = await Document.findByPk(id);
  if (!document) throw new AppError("not_found", "That document was not found");
  return document;
}

/**
 * A work-order attachment is private to the two parties; an admin may open one to settle a dispute, and that reading is
 * recorded on the work order itself, where the parties' own history lives.
 */
async function recordDisputeRead(user: Express.User, document: Document) {
  if (document.workOrderId === null || (await documentAccessFor(user, document.id)) !== "dispute") return;
  await recordAudit({
    actorUserId: user.id,
    action: "work_order.attachment_read_by_admin",
    subjectType: "work_order",
    subjectId: document.workOrderId,
    after: { documentId: document.id },
  });
}

// Files are served as data, never as pages: no sniffing, no scripts, and a download by default.
function setFileHeaders(res: Response, mime: string, disposition: "inline" | "attachment", name: string) {
  res.setHeader("Content-Type", mime);
  res.setHeader("X-Content-Type-Options", "nosniff");
  res.setHeader("Content-Security-Policy", "default-src 'none'; sandbox");
  res.setHeader("Cache-Control", "private, no-store");
  res.setHeader("Content-Disposition", contentDisposition(disposition, name));
}

/** Sends the stored file; only images may be shown inline (a PDF is previewed as rendered pages instead). */
export async function sendDocumentFile(
  user: Express.User,
  id: number,
  inline: boolean,
  storage: FileStorage,
  res: Response,
) {
  const document = await loadDocument(id);
  await recordDisputeRead(user, document);
  await recordAudit({
    actorUserId: user.id,
    action: "document.downloaded",
    subjectType: "document",
    subjectId: id,
  });
  const disposition = inline && document.mime.startsWith("image/") ? "inline" : "attachment";
  setFileHeaders(res, document.mime, disposition, document.originalName);
  const stream = await storage.open(document.sha256);
  await new Promise<void>((resolve, reject) => {
    stream.on("error", reject);
    res.on("finish", resolve);
    stream.pipe(res);
  });
}

/**
 * A PNG of one page of a PDF, rendered by poppler's pdftoppm within the render bounds (pixels, memory, the shared queue,
 * a time limit): nothing of the PDF runs in the browser.
 */
export async function sendPdfPage(
  user: Express.User,
  id: number,
  page: number,
  storage: FileStorage,
  res: Response,
) {
  const document = await loadDocument(id);
  await recordDisputeRead(user, document);
  if (document.mime !== "application/pdf" || page > MAX_PREVIEW_PAGES)
    throw new AppError("not_found", "No such page");
  const dir = await mkdtemp(path.join(tmpdir(), "clearbench-page-"));
  try {
    const chunks: Buffer[] = [];
    for await (const chunk of await storage.open(document.sha256)) chunks.push(chunk as Buffer);
    const pdfPath = path.join(dir, "in.pdf");
    await writeFile(pdfPath, Buffer.concat(chunks));
    // The resolution comes from the page's own size, so a page declared huge still renders to a bounded image.
    const [size] = await pdfPageSizes(pdfPath, page, page);
    if (!size || size.page !== page) throw new AppError("not_found", "No such page");
    const dpi = renderDpi(size, PREVIEW_DPI, MAX_PREVIEW_PIXELS);
    await runBounded(
      "/usr/bin/pdftoppm",
      [
        "-png",
        "-r",
        String(dpi),
        "-f",
        String(page),
        "-l",
        String(page),
        "-singlefile",
        pdfPath,
        path.join(dir, "out"),
      ],
      { timeoutMs: PAGE_RENDER_TIMEOUT_MS },
    ).catch((err: unknown) => {
      if (err instanceof AppError) throw err;
      throw new AppError("not_found", "No such page");
    });
    const png = await readFile(path.join(dir, "out.png")).catch(() => {
      throw new AppError("not_found", "No such page");
    });
    setFileHeaders(res, "image/png", "inline", `page-${page}.png`);
    res.send(png);
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}
