import type { OnSiteDetailsDto } from "./schemas.ts";

const usd = new Intl.NumberFormat("en-US", { style: "currency", currency: "USD" });

/** "$1,250.00" from whole cents: money is stored as an integer and turned into dollars only to be read. */
export const dollarsFromCents = (cents: number): string => usd.format(cents / 100);

/** One street-address line, e.g. "400 Foundry Row, Chicago, IL 60601". */
export function addressOf(details: OnSiteDetailsDto): string {
  const place = [details.city, [details.state, details.postalCode].filter(Boolean).join(" ")]
    .filter(Boolean)
    .join(", ");
  return [details.addressLine, place].filter(Boolean).join(", ");
}

/** The labelled lines the job sheet shows in the same order on the page, in the e-mail and on the printed proof. */
export function onSiteLines(details: OnSiteDetailsDto): [string, string][] {
  const contact = [details.siteContactName, details.siteContactPhone].filter(Boolean).join(", ");
  return [
    ["Street address", addressOf(details)],
    ["On-site contact", contact || "Not given; ask at the front office"],
    ["PO number", details.poNumber ?? "None given"],
    [
      "Not to exceed",
      details.notToExceedCents === null
        ? "No limit given; agree the price before extra work"
        : `${dollarsFromCents(details.notToExceedCents)} (ask the shop before going past it)`,
    ],
    ["Site safety induction", details.safetyInductionNote ?? "None recorded; ask on arrival"],
  ];
}
