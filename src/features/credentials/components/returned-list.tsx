import { Link } from "react-router-dom";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { StatusBadge } from "@/components/ui/status-badge.tsx";
import { formatDateTime } from "@/lib/format-date-time.ts";
import type { CredentialDto as Credential } from "@shared/credentials/credential-shapes.ts";

type ReturnedListProps = { credentials: Credential[]; correctionHref: (credential: Credential) => string };

/** Documents a reviewer sent back, each with the reason and the way to answer it. */
export function ReturnedList({ credentials, correctionHref }: ReturnedListProps) {
  if (credentials.length === 0) {
    return (
      <p className="rounded-lg border border-ink-100 bg-white px-4 py-3 text-sm text-ink-700">
        Nothing was returned to you.
      </p>
    );
  }
  return (
    <ul className="space-y-3">
      {credentials.map((c) => (
        <li key={c.id} className="rounded-lg border border-ink-100 bg-white px-4 py-3">
          <div className="flex flex-wrap items-center gap-2">
            <StatusBadge status="returned" />
            <span className="font-semibold text-ink-900">{c.typeName}</span>
            <span className="text-sm text-ink-700">· {c.technicianName ?? `${c.companyName} (company)`}</span>
          </div>
          <p className="mt-2 text-sm text-ink-900">
            <span className="font-semibold">Reason:</span> {c.returnReason ?? "No reason given."}
          </p>
          {c.decidedAt && <p className="text-sm text-ink-700">Returned {formatDateTime(c.decidedAt)}</p>}
          <Link to={correctionHref(c)} className={buttonStyles("secondary", "mt-3")}>
            Submit a corrected one<span className="sr-only"> for {c.typeName}</span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
