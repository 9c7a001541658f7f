import { QueryTypes } from "sequelize";
import {
  MACHINE_PHOTO_MAX_PX,
  MAX_PHOTOS_PER_MACHINE,
  type MachinePhotoDto,
} from "../../shared/machines/photos.ts";
import { db } from "../db/sequelize.ts";
import { AppError, notFound } from "../http/app-error.ts";
import { readCleanPhoto } from "../http/photo-upload.ts";
import { recordAudit } from "../audit/index.ts";

interface PhotoRow {
  id: number;
  machineId: number;
  width: number;
  height: number;
  caption: string | null;
  createdAt: Date;
}

const toPhotoDto = (r: PhotoRow): MachinePhotoDto => ({
  id: r.id,
  machineId: r.machineId,
  width: r.width,
  height: r.height,
  caption: r.caption,
  createdAt: new Date(r.createdAt).toISOString(),
  url: `/api/machines/${r.machineId}/photos/${r.id}`,
});

const COLUMNS = `id, equipment_id AS "machineId", width, height, caption, created_at AS "createdAt"`;

export async function listMachinePhotos(machineId: number): Promise<MachinePhotoDto[]> {
  const rows = await db().query<PhotoRow>(
    `SELECT ${COLUMNS} FROM machine_photos WHERE equipment_id = $1 ORDER BY id`,
    { bind: [machineId], type: QueryTypes.SELECT },
  );
  return rows.map(toPhotoDto);
}

/**
 * The photo goes through the same byte check, shrink and EXIF strip as a badge photo before anything is written; the
 * row and its audit event commit together, so a refused upload leaves neither a row nor a file.
 */
export async function addMachinePhoto(
  actor: Express.User,
  machineId: number,
  file: Express.Multer.File | undefined,
  caption: string | undefined,
): Promise<MachinePhotoDto> {
  const photo = await readCleanPhoto(file, MACHINE_PHOTO_MAX_PX);
  return db().transaction(async (transaction) => {
    // The machine row is locked so two uploads at once cannot both pass the count.
    const [machine] = await db().query<{ id: number }>("SELECT id FROM equipment WHERE id = $1 FOR UPDATE", {
      bind: [machineId],
      type: QueryTypes.SELECT,
      transaction,
    });
    if (!machine) throw notFound("That machine");
    const [count] = await db().query<{ n: number }>(
      "SELECT count(*)::int AS n FROM machine_photos WHERE equipment_id = $1",
      { bind: [machineId], type: QueryTypes.SELECT, transaction },
    );
    if (count!.n >= MAX_PHOTOS_PER_MACHINE)
      throw new AppError(
        "conflict",
        `A machine keeps at most ${MAX_PHOTOS_PER_MACHINE} photos; delete one first`,
        [{ path: "file", message: `already ${MAX_PHOTOS_PER_MACHINE} photos` }],
      );
    const [row] = await db().query<PhotoRow>(
      `INSERT INTO machine_photos (equipment_id, jpeg, width, height, caption, uploaded_by)
       VALUES ($1, $2, $3, $4, $5, $6) RETURNING ${COLUMNS}`,
      {
        bind: [machineId, photo.jpeg, photo.width, photo.height, caption || null, actor.id],
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    await recordAudit(
      {
        actorUserId: actor.id,
        action: "machine_photo.added",
        subjectType: "equipment",
        subjectId: machineId,
        after: { photoId: row!.id, width: photo.width, height: photo.height, bytes: photo.jpeg.length },
      },
      transaction,
    );
    return toPhotoDto(row!);
  });
}

export async function readMachinePhoto(machineId: number, photoId: number): Promise<Buffer> {
  const [row] = await db().query<{ jpeg: Buffer }>(
    "SELECT jpeg FROM machine_photos WHERE id = $1 AND equipment_id = $2",
    { bind: [photoId, machineId], type: QueryTypes.SELECT },
  );
  if (!row) throw notFound("That photo");
  return Buffer.from(row.jpeg);
}

export async function deleteMachinePhoto(actor: Express.User, machineId: number, photoId: number) {
  await db().transaction(async (transaction) => {
    const [row] = await db().query<{ id: number }>(
      "DELETE FROM machine_photos WHERE id = $1 AND equipment_id = $2 RETURNING id",
      { bind: [photoId, machineId], type: QueryTypes.SELECT, transaction },
    );
    if (!row) throw notFound("That photo");
    await recordAudit(
      {
        actorUserId: actor.id,
        action: "machine_photo.deleted",
        subjectType: "equipment",
        subjectId: machineId,
        before: { photoId },
      },
      transaction,
    );
  });
}
