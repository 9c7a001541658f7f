import type { UploadedDocumentDto as UploadedDocument } from "@shared/credentials/credential-shapes.ts";

/** Says how the fields were filled in, so the uploader knows how much to trust and what to type. */
export function ExtractionNote({
  extraction,
  readCount,
}: {
  extraction: UploadedDocument["extraction"];
  readCount: number;
}) {
  let text: string;
  if (extraction.method === "none" && !extraction.ocrAvailable) {
    text = "Text could not be read automatically on this server; type the fields from the document.";
  } else if (readCount === 0) {
    text = "Nothing could be read from this document automatically; type the fields from it.";
  } else {
    const how = extraction.method === "ocr" ? "by text recognition" : "from its text";
    text = `${readCount} ${readCount === 1 ? "field was" : "fields were"} read from the document ${how}. Each is marked; check it against the document before you submit.`;
  }
  return (
    <p
      role="status"
      className="rounded-md border-l-4 border-ink-500 bg-ink-50 px-4 py-3 text-sm text-ink-900"
    >
      {text}
    </p>
  );
}
