import { Link } from "react-router-dom";
import { hrefs } from "@/config/paths.ts";
import { StatusBadge } from "@/components/ui/status-badge.tsx";
import type { CredentialDetailDto as CredentialDetail } from "@shared/credentials/credential-shapes.ts";

/**
 * The other coverages sent from the same certificate: the reviewer reads the document once and verifies or
 * returns each coverage on its own.
 */
export function SameDocumentList({
  current,
  rows,
}: {
  current: number;
  rows: CredentialDetail["sameDocument"];
}) {
  if (rows.length < 2) return null;
  return (
    <nav aria-label="Coverages on this document" className="rounded-lg border border-ink-100 bg-white p-4">
      <h2 className="mb-2 text-sm font-semibold text-ink-900">
        {rows.length} coverages were sent from this document; each is decided on its own
      </h2>
      <ul className="space-y-1">
        {rows.map((row) => (
          <li key={row.id} className="flex flex-wrap items-center gap-2 text-sm">
            {row.id === current ? (
              <span aria-current="page" className="font-semibold text-ink-900">
                {row.typeName} (this one)
              </span>
            ) : (
              <Link
                to={hrefs.review(row.id)}
                className="text-ink-900 underline underline-offset-2 focus-visible:outline-2 focus-visible:outline-ink-700"
              >
                {row.typeName}
              </Link>
            )}
            <StatusBadge status={row.state} />
          </li>
        ))}
      </ul>
    </nav>
  );
}
