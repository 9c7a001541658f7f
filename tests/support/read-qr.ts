import { Jimp } from "jimp";
import jsqrModule from "jsqr";

// jsqr ships CommonJS with a default export; either shape may arrive depending on the loader.
const jsQR = ((jsqrModule as unknown as { default?: unknown }).default ??
  jsqrModule) as typeof jsqrModule.default;

/** Reads a QR code from a PNG data URL with a decoder independent of the encoder, as a phone camera would (ISO/IEC 18004). */
export async function readQr(dataUrl: string): Promise<string> {
  const image = await Jimp.read(Buffer.from(dataUrl.replace(/^data:image\/png;base64,/, ""), "base64"));
  const { data, width, height } = image.bitmap;
  const code = jsQR(new Uint8ClampedArray(data), width, height);
  if (!code) throw new Error("no QR code found in the image");
  return code.data;
}
