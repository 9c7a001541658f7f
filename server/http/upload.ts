import multer from "multer";
import { randomUUID } from "node:crypto";
import type { RequestHandler } from "express";
import { appStorage } from "../storage/index.ts";
import { utf8FileName } from "./file-names.ts";
import { MAX_UPLOAD_BYTES } from "../../shared/credentials/upload-limits.ts";

/**
 * multer to disk, never to memory: the file streams into the storage's incoming folder under a random
 * name; the use case commits it or deletes it.
 */
export const singleFileUpload: RequestHandler = (req, res, next) => {
  const locals = req.app.locals as { uploader?: RequestHandler };
  locals.uploader ??= multer({
    storage: multer.diskStorage({
      destination: appStorage(req).incomingDir,
      filename: (_req, _file, cb) => cb(null, `${randomUUID()}.part`),
    }),
    limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 10, fieldSize: 10_000, parts: 12 },
  }).single("file");
  locals.uploader(req, res, (err?: unknown) => {
    if (req.file) req.file.originalname = utf8FileName(req.file.originalname);
    next(err);
  });
};
