import { useId, useState } from "react";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { formatDateTime } from "@/lib/format-date-time.ts";
import { useCalendarFeed, useRotateCalendarFeed, useStopCalendarFeed } from "../api/calendar-feed.ts";

/**
 * The lapse calendar's subscription: the address is a secret, so it is shown once, right after it is made;
 * afterwards only "on since …" shows, and a new address replaces the old one at once.
 */
export function CalendarFeedPanel({ description }: { description: string }) {
  const headingId = useId();
  const status = useCalendarFeed();
  const rotate = useRotateCalendarFeed();
  const stop = useStopCalendarFeed();
  const [shownUrl, setShownUrl] = useState<string | null>(null);
  const active = status.data?.active ?? false;
  const make = () => rotate.mutate(undefined, { onSuccess: (answer) => setShownUrl(answer.url) });
  return (
    <section aria-labelledby={headingId} className="space-y-3 rounded-lg border border-ink-100 bg-white p-4">
      <h2 id={headingId} className="text-lg font-semibold text-ink-900">
        Lapse calendar
      </h2>
      <p className="text-sm text-ink-700">{description}</p>
      {status.isError && <p role="alert">The calendar's state could not be loaded.</p>}
      {status.data && (
        <p className="text-sm text-ink-900" data-calendar-state={active ? "on" : "off"}>
          {active && status.data.createdAt
            ? `Subscription on since ${formatDateTime(status.data.createdAt)}.`
            : "No subscription address yet."}
        </p>
      )}
      {shownUrl && (
        <div className="space-y-1 rounded-md border border-accent-500 bg-ink-50 p-3" role="status">
          <label htmlFor={`${headingId}-url`} className="block text-sm font-semibold text-ink-900">
            Subscription address (copy it now; it is not shown again)
          </label>
          <input
            id={`${headingId}-url`}
            readOnly
            value={shownUrl}
            onFocus={(e) => e.currentTarget.select()}
            className="w-full rounded border border-ink-300 bg-white px-2 py-1 font-mono text-sm"
          />
          <p className="text-sm text-ink-700">
            Paste it into your calendar program's "subscribe to calendar" or "add from URL". Anyone with it
            can read the lapse dates.
          </p>
        </div>
      )}
      <FormError error={rotate.error ?? stop.error} />
      <div className="flex flex-wrap gap-2">
        <Button variant={active ? "secondary" : "primary"} pending={rotate.isPending} onClick={make}>
          {active ? "Make a new address" : "Make a subscription address"}
        </Button>
        {active && (
          <Button
            variant="danger"
            pending={stop.isPending}
            onClick={() => stop.mutate(undefined, { onSuccess: () => setShownUrl(null) })}
          >
            Stop the calendar
          </Button>
        )}
      </div>
      {active && (
        <p className="text-xs text-ink-700">
          A new address stops the old one at once; calendars using it stop updating.
        </p>
      )}
    </section>
  );
}
