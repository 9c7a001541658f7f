import type { FieldSet } from "@shared/credentials/credential-fields.ts";
import { LIMIT_LABELS, limitLinesFor } from "@shared/credentials/limit-lines.ts";
import type { CatalogKind } from "@shared/machines/catalog.ts";

export type FieldKind = "text" | "date" | "dollars" | "checkbox" | "level" | "state" | "names";

export type FieldDefinition = {
  /** Path inside the credential's fields, e.g. "limits.eachOccurrence". */
  path: string;
  label: string;
  kind: FieldKind;
  required?: boolean;
  hint?: string;
  /** A text field picked from the machine catalog (builders, control families). */
  catalog?: CatalogKind;
};

const dateHint = "Leave empty if the document shows none.";

const cardFields: FieldDefinition[] = [
  { path: "holderName", label: "Name on the card", kind: "text", required: true },
  { path: "course", label: "Course", kind: "text" },
  { path: "issueDate", label: "Issue date", kind: "date", required: true },
  { path: "expiryDate", label: "Expiry date", kind: "date", hint: dateHint },
  { path: "cardNumber", label: "Card number", kind: "text" },
  { path: "trainer", label: "Trainer", kind: "text" },
];

/** The inputs for a type, in the order they appear on the document. */
export function fieldDefinitionsFor(fieldSet: FieldSet, typeCode: string): FieldDefinition[] {
  switch (fieldSet) {
    case "insurance":
      return [
        { path: "insurerName", label: "Insurer", kind: "text", required: true },
        {
          path: "naic",
          label: "NAIC company code",
          kind: "text",
          hint: "Five digits, printed beside the insurer.",
        },
        { path: "policyNumber", label: "Policy number", kind: "text", required: true },
        { path: "namedInsured", label: "Named insured", kind: "text" },
        { path: "certificateHolder", label: "Certificate holder", kind: "text" },
        { path: "effectiveDate", label: "Effective date", kind: "date", required: true },
        { path: "expirationDate", label: "Expiration date", kind: "date", required: true },
        ...(typeCode === "workers_comp"
          ? [
              {
                path: "statutory",
                label: "Statutory limits (workers' compensation)",
                kind: "checkbox" as const,
              },
            ]
          : []),
        ...limitLinesFor(typeCode).map((name) => ({
          path: `limits.${name}`,
          label: LIMIT_LABELS[name],
          kind: "dollars" as const,
          hint: "Whole dollars",
        })),
        { path: "additionalInsured", label: "Additional insured marked", kind: "checkbox" },
        { path: "waiverOfSubrogation", label: "Waiver of subrogation marked", kind: "checkbox" },
      ];
    case "training":
      return cardFields;
    case "oem":
      return [
        { path: "builder", label: "Machine builder", kind: "text", required: true, catalog: "builder" },
        {
          path: "controlFamily",
          label: "Control family",
          kind: "text",
          required: true,
          catalog: "control_family",
        },
        { path: "level", label: "Level", kind: "level", required: true },
        ...cardFields,
      ];
    case "license":
      return [
        { path: "holderName", label: "Name on the license", kind: "text", required: true },
        { path: "licenseNumber", label: "License number", kind: "text", required: true },
        { path: "issuingAuthority", label: "Issuing authority", kind: "text", required: true },
        { path: "issueDate", label: "Issue date", kind: "date", required: true },
        { path: "expiryDate", label: "Expiry date", kind: "date", hint: dateHint },
      ];
    case "exemption":
      return [
        { path: "holderName", label: "Name on the exemption", kind: "text", required: true },
        {
          path: "personsCovered",
          label: "Persons the exemption names",
          kind: "names",
          hint: "The sole proprietor or officers, separated by semicolons. It clears only these people, never employees.",
        },
        { path: "state", label: "State", kind: "state", required: true, hint: "Two letters, e.g. TX" },
        { path: "certificateNumber", label: "Certificate number", kind: "text", required: true },
        { path: "issueDate", label: "Issue date", kind: "date", required: true },
        {
          path: "expiryDate",
          label: "Expiry date",
          kind: "date",
          hint: "Leave empty if the document shows none: it then counts for 24 months from issue (common practice; terms vary by state).",
        },
      ];
  }
}
