import { describe, expect, it } from "vitest";
import { Jimp } from "jimp";
import { pageOrientation } from "../../../server/credentials/extraction/page-orientation.ts";
import { greyOf, turnedGrey } from "../../../server/credentials/extraction/grey-pixels.ts";
import { buildCertificatePdf } from "../../fixtures/build-certificate-pdf.ts";
import { buildPageImages } from "../../fixtures/build-page-images.ts";
import { buildCardPng } from "../../fixtures/build-training-card.ts";

/** The angle between two turns, whichever way round, in degrees (0 to 180). */
const apart = (a: number, b: number) => Math.abs(((((a - b) % 360) + 540) % 360) - 180);

describe("the turn and tilt of a photographed page, from its pixels", () => {
  it.each([0, 3.5, -2.6, 88.5, 93.4, 177.2, 183.6, -91, 268])(
    "makes a certificate photographed at %s degrees upright and level",
    async (degrees) => {
      const { bytes } = await buildCertificatePdf({ seed: 61 });
      const [png] = await buildPageImages(bytes, 100);
      const image = await Jimp.read(Buffer.from(png!));
      image.background = 0xffffffff;
      // Jimp turns counter-clockwise, as the measure answers.
      if (degrees) image.rotate(degrees);

      const measured = pageOrientation(greyOf(image.bitmap));
      const levelled = pageOrientation(turnedGrey(greyOf(image.bitmap), measured.degrees));

      expect(apart(measured.degrees, -degrees)).toBeLessThanOrEqual(0.5);
      // Turned by the measure, the page measures upright and level.
      expect(apart(levelled.degrees, 0)).toBeLessThanOrEqual(0.5);
    },
  );

  it("tells an upside-down card from an upright one", async () => {
    const { bytes } = await buildCardPng({ seed: 62 });
    const upright = await Jimp.read(Buffer.from(bytes));
    const upsideDown = upright.clone().rotate(180);

    expect(apart(pageOrientation(greyOf(upright.bitmap)).degrees, 0)).toBeLessThanOrEqual(0.5);
    expect(apart(pageOrientation(greyOf(upsideDown.bitmap)).degrees, 180)).toBeLessThanOrEqual(0.5);
  });

  it("is not sure of a blank page", async () => {
    const blank = new Jimp({ width: 400, height: 500, color: 0xffffffff });

    expect(pageOrientation(greyOf(blank.bitmap))).toEqual({ degrees: 0, sure: false });
  });
});
