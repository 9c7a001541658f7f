/**
 * Jimp and its codecs hold about 40 MB once loaded; most server processes never read an image, so it is loaded on the
 * first photo, thumbnail or OCR page rather than at start-up.
 */
export async function loadJimp() {
  return (await import("jimp")).Jimp;
}
