import { z } from "zod";
import {
  addMachinePhotoSchema,
  machinePhotoSchema,
  machineParamsSchema,
  machinePhotoParamsSchema,
} from "../../shared/machines/photos.ts";
import { createRoutes } from "../http/route.ts";
import { singleFileUpload } from "../http/upload.ts";
import { canManageMachinePhotos, canOpenMachinePhoto } from "./photo-policy.ts";
import { addMachinePhoto, deleteMachinePhoto, listMachinePhotos, readMachinePhoto } from "./photo-service.ts";

export const machinePhotoRoutes = createRoutes("/api/machines");

machinePhotoRoutes.get(
  "/:machineId/photos",
  { allow: canManageMachinePhotos, params: machineParamsSchema, response: z.array(machinePhotoSchema) },
  (_req, _res, { params }) => listMachinePhotos(params.machineId),
);

machinePhotoRoutes.post(
  "/:machineId/photos",
  {
    allow: canManageMachinePhotos,
    before: [singleFileUpload],
    params: machineParamsSchema,
    body: addMachinePhotoSchema,
    response: machinePhotoSchema,
    status: 201,
  },
  (req, _res, { params, body }) => addMachinePhoto(req.user!, params.machineId, req.file, body.caption),
);

machinePhotoRoutes.get(
  "/:machineId/photos/:photoId",
  { allow: canOpenMachinePhoto, params: machinePhotoParamsSchema },
  async (_req, res, { params }) => {
    const jpeg = await readMachinePhoto(params.machineId, params.photoId);
    // Always re-encoded JPEG, served as such and never sniffed into anything else; private to the signed-in shop.
    res
      .type("image/jpeg")
      .set("Cache-Control", "private, max-age=3600")
      .set("X-Content-Type-Options", "nosniff")
      .set(
        "Content-Disposition",
        `inline; filename="machine-${params.machineId}-photo-${params.photoId}.jpg"`,
      )
      .send(jpeg);
  },
);

machinePhotoRoutes.delete(
  "/:machineId/photos/:photoId",
  { allow: canOpenMachinePhoto, params: machinePhotoParamsSchema },
  async (req, _res, { params }) => {
    await deleteMachinePhoto(req.user!, params.machineId, params.photoId);
  },
);
