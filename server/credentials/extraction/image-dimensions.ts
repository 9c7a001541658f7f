import { open } from "node:fs/promises";

export interface ImageDimensions {
  width: number;
  height: number;
}

// A PNG or JPEG states its size in its first bytes; reading it there costs nothing, while decoding a small file that
// declares 50,000 × 50,000 pixels would allocate gigabytes in this process.
const HEADER_BYTES = 64 * 1024;

/** Width and height declared by a PNG (IHDR) or JPEG (first SOFn marker), or null when neither is found. */
export function imageDimensionsFromHeader(bytes: Uint8Array): ImageDimensions | null {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const isPng =
    bytes.length >= 24 &&
    bytes[0] === 0x89 &&
    bytes[1] === 0x50 &&
    bytes[2] === 0x4e &&
    bytes[3] === 0x47 &&
    String.fromCharCode(...bytes.subarray(12, 16)) === "IHDR";
  if (isPng) return { width: view.getUint32(16), height: view.getUint32(20) };
  if (bytes.length < 4 || bytes[0] !== 0xff || bytes[1] !== 0xd8) return null;
  let at = 2;
  while (at + 9 < bytes.length) {
    if (bytes[at] !== 0xff) return null;
    const marker = bytes[at + 1]!;
    if (marker === 0xff) {
      at += 1; // fill byte
      continue;
    }
    // SOF0..SOF15 carry the frame size, except DHT (C4), JPG (C8) and DAC (CC).
    const isFrame = marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc;
    if (isFrame) return { width: view.getUint16(at + 7), height: view.getUint16(at + 5) };
    if (marker === 0xd8 || (marker >= 0xd0 && marker <= 0xd7)) {
      at += 2;
      continue;
    }
    at += 2 + view.getUint16(at + 2);
  }
  return null;
}

/** The declared size of an image file, read from its first bytes only. */
export async function imageDimensionsOfFile(path: string): Promise<ImageDimensions | null> {
  const file = await open(path, "r");
  try {
    const buffer = new Uint8Array(HEADER_BYTES);
    const { bytesRead } = await file.read(buffer, 0, HEADER_BYTES, 0);
    return imageDimensionsFromHeader(buffer.subarray(0, bytesRead));
  } finally {
    await file.close();
  }
}
