import type { FieldSet } from "./credential-fields.ts";

/**
 * Ready-made reasons a reviewer can start from and edit before sending: the faults that come back most often. The
 * wording says what to fix, since the uploader reads it with the document in hand (common practice).
 */
const COMMON = [
  "The document is hard to read; upload a clearer scan or the original PDF.",
  "A page is missing; upload the complete document.",
  "This is a different kind of document than the type chosen; upload it under the right type.",
] as const;

const BY_FIELD_SET: Record<FieldSet, readonly string[]> = {
  insurance: [
    "The named insured on the certificate differs from the company's legal name; ask the broker for a corrected certificate.",
    "The policy has already expired; upload the renewal certificate.",
    "The certificate is not signed by an authorized representative; ask the broker for a signed one.",
    "The limits shown are below what the certificate should carry; ask the broker to confirm the limits.",
  ],
  training: [
    "The name on the card differs from the technician's name; upload the technician's own card.",
    "The card has expired; upload the current card.",
  ],
  oem: [
    "The name on the certificate differs from the technician's name; upload the technician's own certificate.",
    "The builder or control family on the certificate does not match what was entered.",
  ],
  license: [
    "The name on the license differs from the technician's name; upload the technician's own license.",
    "The license has expired; upload the current license.",
  ],
  exemption: [
    "The persons named on the exemption are not listed; upload the page that names them.",
    "The exemption has expired; upload the current one from the state.",
  ],
};

export function returnReasonsFor(fieldSet: FieldSet): readonly string[] {
  return [...BY_FIELD_SET[fieldSet], ...COMMON];
}
