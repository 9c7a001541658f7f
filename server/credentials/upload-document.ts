import { rm } from "node:fs/promises";
import type { UploadDocument } from "../../shared/credentials/schemas.ts";
import type { FileStorage } from "../storage/index.ts";
import { activeType } from "./catalogue.ts";
import { resolveHolder } from "./resolve-holder.ts";
import { toUploadedDocumentDto } from "./dto.ts";
import {
  requireAccepted,
  requireFile,
  requireNonEmpty,
  sniffUploadFile,
  type UploadedFile,
} from "./upload-checks.ts";
import { readStagedUpload } from "./upload-reading.ts";
import { saveAndCommitUpload, type UploadOptions } from "./upload-saving.ts";
import { sha256OfFile, stageUpload } from "./upload-staging.ts";

export type { UploadedFile } from "./upload-checks.ts";
export type { UploadOptions } from "./upload-saving.ts";

/**
 * Stores an uploaded file and proposes fields read from it: check, sniff, hash, stage, read, save, commit. The
 * temporary (then staged) file is removed whatever happens, so a refusal at any step leaves no row and no file.
 */
export async function uploadDocument(
  user: Express.User,
  input: UploadDocument,
  file: UploadedFile | undefined,
  storage: FileStorage,
  options: UploadOptions = {},
) {
  let pending = file?.path;
  try {
    requireFile(file);
    const type = await activeType(input.typeCode);
    const technicianId = (await resolveHolder(user, type, input.technicianId)) ?? null;
    requireNonEmpty(file);

    const mime = await sniffUploadFile(file.path, file.originalname);
    requireAccepted(mime, options.acceptOnly);
    const sha256 = await sha256OfFile(file.path);
    const staged = await stageUpload(file.path, sha256, mime, storage, (path) => (pending = path));
    const reading = await readStagedUpload(staged, mime, { code: type.code, fieldSet: type.fieldSet });
    const document = await saveAndCommitUpload(
      user,
      { file, sha256, mime, typeCode: type.code, technicianId, reading },
      staged,
      storage,
      options,
    );
    return toUploadedDocumentDto({ user, type, technicianId, document, reading });
  } finally {
    if (pending) await rm(pending, { force: true });
  }
}
