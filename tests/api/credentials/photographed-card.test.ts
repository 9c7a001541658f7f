import { describe, expect, it } from "vitest";
import { buildCorpus, type CardTruth } from "../../../jobs/extraction-corpus/build-corpus.ts";
import { photographPage } from "../../../jobs/extraction-corpus/photograph.ts";
import { extractDocument } from "../../../server/credentials/extraction/extract-document.ts";
import { LOW_CONFIDENCE } from "../../../shared/credentials/locate-values.ts";

// One slow test (three tesseract passes or more): a card photographed upside down and a few degrees off level.
describe("a photographed training card", () => {
  it("is turned upright and levelled, then read by word position with a box for each value", async () => {
    const card = (await buildCorpus(1)).find((doc) => doc.truth.family === "card/colon/0")!;
    const truth = card.truth as CardTruth;
    const photo = await photographPage(card.bytes, { degrees: 182.5, blur: 1, noise: 12, shade: 0.2 });
    const read = await extractDocument({
      bytes: photo,
      mime: "image/png",
      credentialType: { code: "lockout_tagout", fieldSet: "training" },
    });
    expect(read.method).toBe("ocr");
    expect(read.proposal?.fields).toMatchObject({
      holderName: truth.holderName,
      cardNumber: truth.cardNumber,
      issueDate: truth.issueDate,
      expiryDate: truth.expiryDate,
    });
    const holder = read.evidence?.lockout_tagout?.holderName;
    expect(holder?.box).toBeDefined();
    expect(holder!.confidence).toBeGreaterThanOrEqual(LOW_CONFIDENCE);
    // Upright: the holder's line sits in the card's upper half, under the title, as printed.
    expect(holder!.box!.y).toBeLessThan(0.5);
  }, 60_000);
});
