import { describe, expect, it } from "vitest";
import { Jimp } from "jimp";
import { imageDimensionsFromHeader } from "../../../server/credentials/extraction/image-dimensions.ts";

describe("image dimensions read from the header", () => {
  it("reads a PNG's IHDR and a JPEG's frame header without decoding the pixels", async () => {
    const image = new Jimp({ width: 37, height: 21, color: 0xffffffff });
    const png = await image.getBuffer("image/png");
    const jpeg = await image.getBuffer("image/jpeg");

    expect(imageDimensionsFromHeader(png)).toEqual({ width: 37, height: 21 });
    expect(imageDimensionsFromHeader(jpeg)).toEqual({ width: 37, height: 21 });
  });

  it("returns null for bytes that are neither", () => {
    expect(imageDimensionsFromHeader(new TextEncoder().encode("%PDF-1.7 not an image"))).toBeNull();
  });
});
