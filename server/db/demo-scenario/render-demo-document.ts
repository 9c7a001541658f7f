import { buildCertificatePdf } from "./documents/build-certificate-pdf.ts";
import { buildTrainingCardPdf } from "./documents/build-training-card.ts";
import type { DemoDocument } from "./demo-world-types.ts";

/** The PDF a demo credential was submitted with, written from the same values as its fields. */
export async function renderDemoDocument(document: DemoDocument): Promise<Uint8Array> {
  if (document.kind === "certificate") return (await buildCertificatePdf(document.values)).bytes;
  return (await buildTrainingCardPdf(document.values)).bytes;
}
