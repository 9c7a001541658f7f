import { readFile, rm } from "node:fs/promises";
import { fileTypeFromBuffer } from "file-type";
import { Jimp } from "jimp";
import { QueryTypes } from "sequelize";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";

export const PHOTO_MAX_PX = 512;

/**
 * Checks the upload from its bytes, shrinks it to fit 512 px and writes a fresh JPEG from the pixels alone, so no
 * EXIF block (GPS position, camera serial, time taken) survives. The temporary file is removed whatever happens.
 */
export async function saveTechnicianPhoto(
  technicianId: number,
  file: Express.Multer.File | undefined,
): Promise<{ width: number; height: number }> {
  if (!file)
    throw new AppError("invalid_input", "Choose a photo to upload", [{ path: "file", message: "required" }]);
  try {
    const bytes = await readFile(file.path);
    if (bytes.length === 0)
      throw new AppError("invalid_input", "The photo is empty", [{ path: "file", message: "0 bytes" }]);
    const type = await fileTypeFromBuffer(bytes);
    if (type?.mime !== "image/jpeg" && type?.mime !== "image/png")
      throw new AppError("unsupported_type", "Only a JPEG or PNG photo is accepted", [
        { path: "file", message: "not a JPEG or PNG image" },
      ]);
    let image;
    try {
      image = await Jimp.read(bytes);
    } catch {
      throw new AppError("invalid_input", "The photo could not be read", [
        { path: "file", message: "damaged or incomplete image" },
      ]);
    }
    if (image.width > PHOTO_MAX_PX || image.height > PHOTO_MAX_PX)
      image.scaleToFit({ w: PHOTO_MAX_PX, h: PHOTO_MAX_PX });
    const jpeg = await image.getBuffer("image/jpeg", { quality: 85 });
    await db().query(
      `INSERT INTO technician_photos (technician_id, jpeg) VALUES ($1, $2)
       ON CONFLICT (technician_id) DO UPDATE SET jpeg = EXCLUDED.jpeg, updated_at = CURRENT_TIMESTAMP`,
      { bind: [technicianId, jpeg] },
    );
    return { width: image.width, height: image.height };
  } finally {
    await rm(file.path, { force: true });
  }
}

/** The stored photo as a data URL for the badge and the gate check, or null when none was added. */
export async function technicianPhotoDataUrl(technicianId: number): Promise<string | null> {
  const [row] = await db().query<{ jpeg: Buffer }>(
    "SELECT jpeg FROM technician_photos WHERE technician_id = $1",
    {
      bind: [technicianId],
      type: QueryTypes.SELECT,
    },
  );
  return row ? `data:image/jpeg;base64,${Buffer.from(row.jpeg).toString("base64")}` : null;
}
