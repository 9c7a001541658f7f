// What a buyer may read of a credential's fields: dates, limits, flags and training details. Left out: the name and
// card number printed on a technician's card, and the certificate holder (another customer) named on a certificate.
const FIELDS_FOR_BUYERS: ReadonlySet<string> = new Set([
  "insurerName",
  "naic",
  "policyNumber",
  "effectiveDate",
  "expirationDate",
  "limits",
  "additionalInsured",
  "waiverOfSubrogation",
  "statutory",
  "course",
  "issueDate",
  "expiryDate",
  "builder",
  "controlFamily",
  "level",
  "trainer",
  "licenseNumber",
  "issuingAuthority",
  "state",
]);

export function fieldsForBuyers(fields: Record<string, unknown>): Record<string, unknown> {
  return Object.fromEntries(Object.entries(fields).filter(([key]) => FIELDS_FOR_BUYERS.has(key)));
}
