/**
 * Free mailboxes anyone can open: two parties using one of these share nothing. Common practice (the largest consumer
 * mail providers in the US), not an exhaustive list.
 */
export const PUBLIC_MAIL_DOMAINS: ReadonlySet<string> = new Set([
  "gmail.com",
  "googlemail.com",
  "yahoo.com",
  "ymail.com",
  "outlook.com",
  "hotmail.com",
  "live.com",
  "msn.com",
  "icloud.com",
  "me.com",
  "mac.com",
  "aol.com",
  "proton.me",
  "protonmail.com",
  "gmx.com",
  "mail.com",
  "zoho.com",
  "yandex.com",
  "comcast.net",
  "att.net",
  "verizon.net",
  "sbcglobal.net",
]);

export const selfRatingSignalKinds = ["email_domain", "phone", "address"] as const;
export type SelfRatingSignal = (typeof selfRatingSignalKinds)[number];

export interface PartyContacts {
  emails: readonly string[];
  phones: readonly (string | null)[];
  addresses: readonly { line: string | null; postalCode: string | null }[];
}

function domains(emails: readonly string[]): Set<string> {
  return new Set(
    emails
      .map((e) => e.trim().toLowerCase().split("@")[1] ?? "")
      .filter((d) => d !== "" && !PUBLIC_MAIL_DOMAINS.has(d)),
  );
}

/** The last ten digits: "+1 (312) 555-0101" and "312.555.0101" are one number. */
function phones(list: readonly (string | null)[]): Set<string> {
  return new Set(
    list.map((p) => (p ?? "").replace(/\D/g, "").slice(-10)).filter((digits) => digits.length === 10),
  );
}

/** Street line and five-digit ZIP, case, punctuation and spacing ignored. */
function addresses(list: PartyContacts["addresses"]): Set<string> {
  return new Set(
    list.flatMap(({ line, postalCode }) => {
      const street = (line ?? "")
        .toLowerCase()
        .replace(/[^a-z0-9]+/g, " ")
        .trim();
      const zip = (postalCode ?? "").replace(/\D/g, "").slice(0, 5);
      return street && zip.length === 5 ? [`${street}|${zip}`] : [];
    }),
  );
}

const overlaps = (a: Set<string>, b: Set<string>) => [...a].some((x) => b.has(x));

/** What the shop and the rated technician's company share; any of it suggests a company rating itself. */
export function selfRatingSignals(shop: PartyContacts, service: PartyContacts): SelfRatingSignal[] {
  const found: SelfRatingSignal[] = [];
  if (overlaps(domains(shop.emails), domains(service.emails))) found.push("email_domain");
  if (overlaps(phones(shop.phones), phones(service.phones))) found.push("phone");
  if (overlaps(addresses(shop.addresses), addresses(service.addresses))) found.push("address");
  return found;
}
