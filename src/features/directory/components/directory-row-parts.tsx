import { Link, useSearchParams } from "react-router-dom";
import { hrefs } from "@/config/paths.ts";
import { formatCents } from "@/lib/format-money.ts";
import type { DirectoryRowDto as DirectoryRow } from "@shared/directory/directory-shapes.ts";
import { formatMiles } from "@shared/geo/units.ts";
import { formatDriveTime } from "./directory-format.ts";

/** The directory inputs an estimate rests on, carried to the technician's page so both show the same figure. */
function carriedEstimateInputs(params: URLSearchParams): string {
  const carried = new URLSearchParams();
  for (const key of ["siteId", "onSiteHours"]) {
    const value = params.get(key);
    if (value) carried.set(key, value);
  }
  const text = carried.toString();
  return text ? `?${text}` : "";
}

/** The technician's name as the link to their page, with a marker when they are on the shop's roster. */
export function TechnicianLink({ row }: { row: Pick<DirectoryRow, "technicianId" | "name" | "onRoster"> }) {
  const [params] = useSearchParams();
  return (
    <>
      <Link
        to={hrefs.directoryTechnician(row.technicianId) + carriedEstimateInputs(params)}
        className="inline-flex min-h-11 items-center font-semibold text-ink-900 underline underline-offset-2 focus-visible:outline-2 focus-visible:outline-ink-700 md:min-h-0"
      >
        {row.name}
      </Link>
      {row.onRoster && (
        <span
          className="ml-2 inline-block rounded-full border border-ink-300 bg-ink-50 px-2 py-0.5 text-xs font-medium text-ink-800"
          data-testid="on-roster-marker"
        >
          {row.onRoster === "technician" ? "On your roster" : "Company on your roster"}
        </span>
      )}
    </>
  );
}

/** Straight-line distance, said so, and the estimated drive. */
export function DistanceText({ row }: { row: DirectoryRow }) {
  if (row.distanceKm === null) return <span className="text-sm text-ink-700">Choose a site</span>;
  return (
    <span className="text-sm">
      <span className="whitespace-nowrap text-ink-900">{formatMiles(row.distanceKm)}</span>{" "}
      <span className="whitespace-nowrap text-xs text-ink-700">straight line</span>
      {row.driveHours !== null && (
        <span className="block whitespace-nowrap text-ink-800">
          about {formatDriveTime(row.driveHours)} drive
        </span>
      )}
    </span>
  );
}

export function RatesText({ row }: { row: DirectoryRow }) {
  return (
    <span className="text-sm text-ink-900">
      <span className="whitespace-nowrap">{formatCents(row.hourlyRateCents)}/h on site</span>{" "}
      <span className="whitespace-nowrap text-ink-700">{formatCents(row.travelRateCents)}/h travel</span>
    </span>
  );
}
