import { useZipZone } from "../api/look-up-zip-zone.ts";

function zoneName(timeZone: string): string {
  const part = new Intl.DateTimeFormat("en-US", { timeZone, timeZoneName: "long" })
    .formatToParts(new Date())
    .find((p) => p.type === "timeZoneName");
  return part ? `${part.value.replace(/ (Standard|Daylight) Time$/, " Time")} (${timeZone})` : timeZone;
}

/** Before the account exists: the zone its policy periods will run on, and that only the address changes it. */
export function ZipZoneNote({ zip }: { zip: string }) {
  const place = useZipZone(zip);
  if (!place.data) return null;
  return (
    <p role="status" className="rounded-md bg-ink-50 px-3 py-2 text-sm text-ink-900">
      {place.data.city}, {place.data.state}: policy periods and card dates run on{" "}
      <span className="font-semibold">{zoneName(place.data.timeZone)}</span>. It changes only when you change
      the company&apos;s address.
    </p>
  );
}
