import { Link } from "react-router-dom";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { StatusBadge } from "@/components/ui/status-badge.tsx";
import { formatDateTime } from "@/lib/format-date-time.ts";
import type { CredentialDto as Credential } from "@shared/credentials/credential-shapes.ts";

type LapsedListProps = { credentials: Credential[]; renewHref: (credential: Credential) => string };

/** Credentials that no longer count and have no renewal on file: each holder is out of the directory until renewed. */
export function LapsedList({ credentials, renewHref }: LapsedListProps) {
  if (credentials.length === 0) {
    return (
      <p className="rounded-lg border border-ink-100 bg-white px-4 py-3 text-sm text-ink-700">
        Nothing has lapsed.
      </p>
    );
  }
  return (
    <ul className="space-y-3">
      {credentials.map((c) => (
        <li key={c.id} className="rounded-lg border border-accent-500 bg-white px-4 py-3">
          <div className="flex flex-wrap items-center gap-2">
            <StatusBadge status="lapsed" />
            <span className="font-semibold text-ink-900">{c.typeName}</span>
            <span className="text-sm text-ink-700">· {c.technicianName ?? `${c.companyName} (company)`}</span>
          </div>
          {c.lapsesAt && (
            <p className="mt-1 text-sm text-ink-700">Stopped counting {formatDateTime(c.lapsesAt)}</p>
          )}
          <Link to={renewHref(c)} className={buttonStyles("primary", "mt-3")}>
            Upload the renewal<span className="sr-only"> for {c.typeName}</span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
