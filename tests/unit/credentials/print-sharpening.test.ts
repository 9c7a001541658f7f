import { describe, expect, it } from "vitest";
import { sharpeningFor } from "../../../server/credentials/extraction/ocr.ts";

/** Dark bars on white paper, each edge spread over `ramp` pixels (1 is crisp print, more is a blurred photo). */
function bars(ramp: number) {
  const width = 200;
  const height = 40;
  const grey = new Uint8Array(width * height);
  for (let y = 0; y < height; y += 1)
    for (let x = 0; x < width; x += 1) {
      // Distance into the nearest bar (bars 10 px wide every 25 px), negative outside it.
      const into = 5 - Math.abs((x % 25) - 12.5);
      const ink = Math.max(0, Math.min(1, into / ramp + 0.5));
      grey[y * width + x] = Math.round(240 - ink * 220);
    }
  return { width, height, grey };
}

describe("how a photo's print is prepared for tesseract", () => {
  // Common practice: a blurred page binarised with a lower Sauvola k keeps the grey of spread ink as ink.
  it("leaves crisp print alone and keeps tesseract's own threshold", () => {
    expect(sharpeningFor(bars(1))).toBeUndefined();
  });

  it("sharpens blurred print hard and lowers Sauvola's k for it", () => {
    const blurred = sharpeningFor(bars(12));

    expect(blurred?.thresholdK).toBe(0.2);
    expect(blurred?.radius).toBeGreaterThan(0);
  });
});
