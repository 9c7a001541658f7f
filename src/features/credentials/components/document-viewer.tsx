import { useEffect, useRef, useState } from "react";
import type { PageBox } from "@shared/credentials/locate-values.ts";
import { documentUrls } from "./document-urls.ts";

// A guard against a document that claims endless pages; certificates and cards run to a few.
const MAX_PAGES = 40;

type DocumentViewerProps = {
  documentId: number;
  name: string;
  mime: string;
  /** The box of the value in focus on the review form, as fractions of its page. */
  highlight?: PageBox | undefined;
  /** Pages to show at most: the upload page's preview needs only the first. */
  pageLimit?: number;
};

/**
 * The document as images: a photo scaled to fit, or each page of a PDF rendered by the server. The PDF
 * itself is never embedded, so a hostile file cannot run in the reviewer's browser. Pages load one after
 * another until the server answers 404 for the next one.
 */
export function DocumentViewer({
  documentId,
  name,
  mime,
  highlight,
  pageLimit = MAX_PAGES,
}: DocumentViewerProps) {
  const [shown, setShown] = useState(1);
  const marked = useRef<HTMLDivElement>(null);
  useEffect(() => {
    marked.current?.scrollIntoView?.({ block: "nearest", behavior: "smooth" });
  }, [highlight]);
  const [ended, setEnded] = useState<number | null>(null);
  const isImage = mime.startsWith("image/");

  return (
    <section aria-label={`Document: ${name}`} className="space-y-3">
      <div className="flex flex-wrap items-center justify-between gap-2 text-sm">
        <p className="truncate font-medium text-ink-900">{name}</p>
        <a
          href={documentUrls.download(documentId)}
          className="text-ink-700 underline underline-offset-2 focus-visible:outline-2 focus-visible:outline-ink-700"
        >
          Download the file
        </a>
      </div>
      {isImage ? (
        <img
          src={documentUrls.inlineImage(documentId)}
          alt={`The uploaded image: ${name}`}
          className="h-auto w-full rounded-md border border-ink-100 bg-white object-contain"
        />
      ) : (
        <ol className="space-y-3">
          {Array.from({ length: ended === null ? shown : Math.min(shown, ended - 1) }, (_, i) => i + 1).map(
            (page) => (
              <li key={page} className="relative">
                <img
                  src={documentUrls.page(documentId, page)}
                  alt={`Page ${page} of ${name}`}
                  className="h-auto w-full rounded-md border border-ink-100 bg-white"
                  onLoad={() => {
                    if (page === shown && page < Math.min(pageLimit, MAX_PAGES)) setShown(page + 1);
                  }}
                  onError={() => setEnded((current) => (current === null || page < current ? page : current))}
                />
                {highlight?.page === page && (
                  <div
                    ref={marked}
                    data-testid="read-here"
                    aria-hidden="true"
                    className="pointer-events-none absolute rounded-sm bg-amber-300/30 outline-2 outline-amber-600"
                    style={{
                      left: `${highlight.x * 100}%`,
                      top: `${highlight.y * 100}%`,
                      width: `${highlight.w * 100}%`,
                      height: `${highlight.h * 100}%`,
                    }}
                  />
                )}
              </li>
            ),
          )}
        </ol>
      )}
      {!isImage && ended === 1 && (
        <p role="status" className="text-sm text-ink-700">
          The pages of this document cannot be shown here. Download the file to read it.
        </p>
      )}
    </section>
  );
}
