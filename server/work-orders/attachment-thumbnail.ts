import { loadJimp } from "../http/jimp.ts";
import { QueryTypes, type Transaction } from "sequelize";
import { imageDimensionsFromHeader } from "../credentials/index.ts";
import { db } from "../db/sequelize.ts";
import { log } from "../log.ts";

/** The longer side of a thread's thumbnail, in pixels: two lines of text tall beside a message. */
export const THUMBNAIL_MAX_PX = 240;

/**
 * The largest picture decoded for a thumbnail: 24 megapixels (a current phone camera) is about 96 MB of pixels in this
 * process. A larger one, or one whose header states no size, gets no thumbnail and is shown as a link with its size.
 */
export const THUMBNAIL_SOURCE_MAX_PIXELS = 24_000_000;

export interface Thumbnail {
  jpeg: Buffer;
  width: number;
  height: number;
}

/** A small JPEG of a PNG or JPEG attachment, or null when it is not an image or too large to decode safely. */
export async function makeThumbnail(bytes: Buffer, mime: string): Promise<Thumbnail | null> {
  if (mime !== "image/png" && mime !== "image/jpeg") return null;
  const declared = imageDimensionsFromHeader(bytes);
  if (!declared || declared.width * declared.height > THUMBNAIL_SOURCE_MAX_PIXELS) return null;
  try {
    const image = await (await loadJimp()).read(bytes);
    if (image.width > THUMBNAIL_MAX_PX || image.height > THUMBNAIL_MAX_PX)
      image.scaleToFit({ w: THUMBNAIL_MAX_PX, h: THUMBNAIL_MAX_PX });
    const jpeg = await image.getBuffer("image/jpeg", { quality: 80 });
    return { jpeg, width: image.width, height: image.height };
  } catch (err) {
    // The bytes passed the type check but do not decode (a cut-off upload): the file stays, without a picture.
    log.warn({ err }, "attachment thumbnail could not be made");
    return null;
  }
}

export async function saveThumbnail(documentId: number, thumbnail: Thumbnail, transaction: Transaction) {
  await db().query(
    "INSERT INTO attachment_thumbnails (document_id, jpeg, width, height) VALUES ($1, $2, $3, $4)",
    { bind: [documentId, thumbnail.jpeg, thumbnail.width, thumbnail.height], transaction },
  );
}

export async function thumbnailSizes(documentIds: number[]) {
  if (documentIds.length === 0) return new Map<number, { width: number; height: number }>();
  const rows = await db().query<{ document_id: number; width: number; height: number }>(
    "SELECT document_id, width, height FROM attachment_thumbnails WHERE document_id = ANY($1::int[])",
    { bind: [documentIds], type: QueryTypes.SELECT },
  );
  return new Map(rows.map((r) => [r.document_id, { width: r.width, height: r.height }]));
}

export async function thumbnailJpeg(documentId: number): Promise<Buffer | null> {
  const [row] = await db().query<{ jpeg: Buffer }>(
    "SELECT jpeg FROM attachment_thumbnails WHERE document_id = $1",
    { bind: [documentId], type: QueryTypes.SELECT },
  );
  return row ? Buffer.from(row.jpeg) : null;
}
