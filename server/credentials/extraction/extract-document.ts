import type { FieldSet } from "../../../shared/credentials/credential-fields.ts";
import {
  proposeCoverages,
  proposeFields,
  type CertificateProposal,
  type FieldProposal,
} from "../../../shared/credentials/extract-fields.ts";
import {
  locateValues,
  type Evidence,
  type PositionedText,
} from "../../../shared/credentials/locate-values.ts";
import { isOcrAvailable, ocrImageLayout, ocrPdfLayout, type OcrOptions } from "./ocr.ts";
import { extractPdfText } from "./pdf-text.ts";
import { DOCUMENT_MIMES, type DocumentMime } from "../../../shared/credentials/upload-limits.ts";

export const extractableMimes = DOCUMENT_MIMES;
export type ExtractableMime = DocumentMime;

export interface ExtractDocumentInput {
  bytes: Uint8Array;
  /** Sniffed from the bytes by the caller, never taken from the upload's claim. */
  mime: ExtractableMime;
  /** The credential being submitted; without it only the text is returned. */
  credentialType?: { code: string; fieldSet: FieldSet };
  timeoutMs?: number;
  ocr?: OcrOptions;
}
export interface ExtractedDocument {
  text: string;
  method: "pdf_text" | "ocr" | "none";
  ocrAvailable: boolean;
  proposal: FieldProposal | null;
  /** For a certificate of insurance: every coverage found on it, and the parties printed once. */
  certificate?: CertificateProposal | undefined;
  /** Confidence and page box of each proposed field, by credential type code. */
  evidence?: Record<string, Evidence> | undefined;
}

// A scan can carry a few stray characters in its text layer (a stamp, a page number); below this it counts as no text.
const MIN_TEXT_CHARACTERS = 20;

const hasTextLayer = (text: string): boolean =>
  (text.match(/[A-Za-z0-9]/g) ?? []).length >= MIN_TEXT_CHARACTERS;

async function readText(
  input: ExtractDocumentInput,
  ocrAvailable: boolean,
): Promise<Pick<ExtractedDocument, "text" | "method"> & { items: PositionedText[] }> {
  const ocrOptions = { ...input.ocr, ...(input.timeoutMs ? { timeoutMs: input.timeoutMs } : {}) };
  if (input.mime === "application/pdf") {
    const pdf = await extractPdfText(input.bytes, input.timeoutMs ? { timeoutMs: input.timeoutMs } : {});
    if (hasTextLayer(pdf.text)) return { text: pdf.text, method: "pdf_text", items: pdf.items };
    if (!ocrAvailable) return { text: "", method: "none", items: [] };
    return { ...(await ocrPdfLayout(input.bytes, ocrOptions)), method: "ocr" };
  }
  if (!ocrAvailable) return { text: "", method: "none", items: [] };
  return { ...(await ocrImageLayout(input.bytes, ocrOptions)), method: "ocr" };
}

/**
 * Reads an uploaded document: the PDF's own text first, OCR for scans and photos. Without OCR on the
 * machine the method is "none" and the form asks for the fields by hand. Throws DocumentUnreadableError.
 */
export async function extractDocument(input: ExtractDocumentInput): Promise<ExtractedDocument> {
  const ocrAvailable = await isOcrAvailable(input.ocr);
  const { text, method, items } = await readText(input, ocrAvailable);
  const type = input.credentialType;
  const proposal = type && method !== "none" ? proposeFields(type.code, type.fieldSet, text) : null;
  const certificate =
    type?.fieldSet === "insurance" && method !== "none" ? proposeCoverages(text) : undefined;
  if (!type || method === "none") return { text, method, ocrAvailable, proposal, certificate };
  const evidence: Record<string, Evidence> = {};
  for (const coverage of certificate?.coverages ?? []) {
    const { fields, found } = coverage.proposal;
    evidence[coverage.typeCode] = locateValues(fields as Record<string, unknown>, found, items, method);
  }
  if (proposal && !evidence[type.code])
    evidence[type.code] = locateValues(
      proposal.fields as Record<string, unknown>,
      proposal.found,
      items,
      method,
    );
  return { text, method, ocrAvailable, proposal, certificate, evidence };
}
