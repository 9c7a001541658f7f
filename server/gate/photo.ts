import { QueryTypes } from "sequelize";
import { readCleanPhoto } from "../http/photo-upload.ts";
import { db } from "../db/sequelize.ts";

export const PHOTO_MAX_PX = 512;

/** A badge photo: checked, shrunk to fit 512 px and stripped of EXIF by the one photo path, then kept in the row. */
export async function saveTechnicianPhoto(
  technicianId: number,
  file: Express.Multer.File | undefined,
): Promise<{ width: number; height: number }> {
  const photo = await readCleanPhoto(file, PHOTO_MAX_PX);
  await db().query(
    `INSERT INTO technician_photos (technician_id, jpeg) VALUES ($1, $2)
     ON CONFLICT (technician_id) DO UPDATE SET jpeg = EXCLUDED.jpeg, updated_at = CURRENT_TIMESTAMP`,
    { bind: [technicianId, photo.jpeg] },
  );
  return { width: photo.width, height: photo.height };
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
  return row ? jpegDataUrl(row.jpeg) : null;
}

/** Stored JPEG bytes as the data URL the badge and the gate screen show. */
export const jpegDataUrl = (jpeg: Buffer | Uint8Array) =>
  `data:image/jpeg;base64,${Buffer.from(jpeg).toString("base64")}`;
