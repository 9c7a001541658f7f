import { z } from "zod";
import { singleLineText } from "../api/text.ts";
import { idParam } from "../credentials/schemas.ts";

/** Big enough to read a builder's nameplate on a phone, small enough to keep in the row (common practice). */
export const MACHINE_PHOTO_MAX_PX = 1600;
/** A machine's page shows its photos in one strip; past this a shop is filing documents, not photos. */
export const MAX_PHOTOS_PER_MACHINE = 24;

export const machineParamsSchema = z.object({ machineId: idParam });
export const machinePhotoParamsSchema = z.object({ machineId: idParam, photoId: idParam });

export const addMachinePhotoSchema = z.object({
  caption: singleLineText().trim().max(200).optional(),
});

export const machinePhotoSchema = z.object({
  id: z.number(),
  machineId: z.number(),
  width: z.number(),
  height: z.number(),
  caption: z.string().nullable(),
  createdAt: z.string(),
  url: z.string(),
});
export type MachinePhotoDto = z.infer<typeof machinePhotoSchema>;
