import { StatusBadge } from "./status-badge.tsx";

/** Explains the status shapes once, so nobody has to learn them from colour. */
export function StatusKey() {
  return (
    <section aria-labelledby="status-key" className="rounded-lg border border-ink-100 bg-white px-4 py-3">
      <h2 id="status-key" className="text-sm font-semibold text-ink-900">
        How statuses look
      </h2>
      <ul className="mt-2 flex flex-wrap gap-2">
        <li>
          <StatusBadge status="cleared" />
        </li>
        <li>
          <StatusBadge status="lapsing" daysLeft={12} />
        </li>
        <li>
          <StatusBadge status="not_cleared" />
        </li>
        <li>
          <StatusBadge status="submitted" />
        </li>
        <li>
          <StatusBadge status="returned" />
        </li>
        <li>
          <StatusBadge status="verified" />
        </li>
        <li>
          <StatusBadge status="superseded" />
        </li>
        <li>
          <StatusBadge status="lapsed" />
        </li>
      </ul>
    </section>
  );
}
