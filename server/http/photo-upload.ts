import { readFile, rm } from "node:fs/promises";
import { fileTypeFromBuffer } from "file-type";
import { loadJimp } from "./jimp.ts";
import { AppError } from "./app-error.ts";

export interface CleanPhoto {
  jpeg: Buffer;
  width: number;
  height: number;
}

/**
 * Checks an uploaded photo from its bytes (JPEG or PNG whatever its name says), shrinks it to fit `maxPx` and writes a
 * fresh JPEG from the pixels alone, so no EXIF block (GPS position, camera serial, time taken) survives. The temporary
 * file is removed whatever happens; the caller stores only the returned bytes.
 */
export async function readCleanPhoto(
  file: Express.Multer.File | undefined,
  maxPx: number,
): Promise<CleanPhoto> {
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
      image = await (await loadJimp()).read(bytes);
    } catch {
      throw new AppError("invalid_input", "The photo could not be read", [
        { path: "file", message: "damaged or incomplete image" },
      ]);
    }
    if (image.width > maxPx || image.height > maxPx) image.scaleToFit({ w: maxPx, h: maxPx });
    const jpeg = await image.getBuffer("image/jpeg", { quality: 85 });
    return { jpeg, width: image.width, height: image.height };
  } finally {
    await rm(file.path, { force: true });
  }
}
