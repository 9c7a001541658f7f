import { useMemo } from "react";
import type { FieldSet } from "@shared/credentials/credential-fields.ts";
import { formatIsoDate, formatInstantDate } from "@/lib/format-date.ts";
import { formatDollars } from "@/lib/format-money.ts";
import type { PreviousVersionDto as PreviousVersion } from "@shared/credentials/credential-shapes.ts";
import { fieldDefinitionsFor, type FieldDefinition } from "./field-definitions.ts";

type VersionComparisonProps = { previous: PreviousVersion | null; fieldSet: FieldSet; typeCode: string };

function shown(value: PreviousVersion["changes"][number]["before"], definition?: FieldDefinition): string {
  if (value === null) return "none";
  if (typeof value === "boolean") return value ? "Yes" : "No";
  if (definition?.kind === "dollars" && typeof value === "number") return formatDollars(value);
  if (definition?.kind === "date" && typeof value === "string") return formatIsoDate(value);
  return String(value);
}

/** What changed since the verified version of the same policy or card: the server compares, this only shows it. */
export function VersionComparison({ previous, fieldSet, typeCode }: VersionComparisonProps) {
  const definitions = useMemo(
    () => new Map(fieldDefinitionsFor(fieldSet, typeCode).map((d) => [d.path, d])),
    [fieldSet, typeCode],
  );
  if (!previous) {
    return (
      <section aria-labelledby="comparison-heading" className="rounded-lg border border-ink-100 bg-white p-4">
        <h2 id="comparison-heading" className="text-lg font-semibold text-ink-900">
          Compared with the last verified version
        </h2>
        <p className="mt-1 text-sm text-ink-700">
          No earlier verified version is on file: this is the first.
        </p>
      </section>
    );
  }
  const when = previous.decidedAt ? formatInstantDate(previous.decidedAt) : "earlier";
  return (
    <section aria-labelledby="comparison-heading" className="rounded-lg border border-ink-100 bg-white p-4">
      <h2 id="comparison-heading" className="text-lg font-semibold text-ink-900">
        Compared with the last verified version
      </h2>
      <p className="mt-1 text-sm text-ink-700">
        The version verified {when}
        {previous.state === "superseded"
          ? " (since replaced)"
          : previous.state === "lapsed"
            ? " (since lapsed)"
            : ""}
        .{" "}
        {previous.changes.length === 0
          ? "No field differs."
          : `${previous.changes.length} field${previous.changes.length === 1 ? "" : "s"} changed.`}
      </p>
      {previous.changes.length > 0 && (
        <div className="mt-3 overflow-x-auto">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Fields changed since the last verified version</caption>
            <thead>
              <tr className="border-b border-ink-100 text-ink-700">
                <th scope="col" className="py-1 pr-3 font-medium">
                  Field
                </th>
                <th scope="col" className="py-1 pr-3 font-medium">
                  Before
                </th>
                <th scope="col" className="py-1 font-medium">
                  Now
                </th>
              </tr>
            </thead>
            <tbody>
              {previous.changes.map((c) => {
                const definition = definitions.get(c.path);
                return (
                  <tr key={c.path} className="border-b border-ink-100 align-top last:border-0">
                    <th scope="row" className="py-1 pr-3 font-medium text-ink-900">
                      {definition?.label ?? c.path}
                    </th>
                    <td className="py-1 pr-3 break-words text-ink-700">{shown(c.before, definition)}</td>
                    <td className="py-1 break-words font-semibold text-ink-900">
                      {shown(c.after, definition)}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
