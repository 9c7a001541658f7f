import type { CertificateValues, CoverageCode } from "./documents/build-certificate-pdf.ts";
import type { TrainingCardValues } from "./documents/build-training-card.ts";
import type { CredentialState } from "../../../shared/credentials/schemas.ts";
import type { DemoCompany } from "./companies.ts";
import type { DemoTechnician } from "./technicians.ts";

/** The document behind a credential: a certificate showing one coverage line, or a wallet card. */
export type DemoDocument =
  | { kind: "certificate"; coverage: CoverageCode; values: CertificateValues; fileName: string }
  | { kind: "card"; values: TrainingCardValues; fileName: string };

export interface DemoCredential {
  key: string;
  typeCode: string;
  companyKey: string;
  technicianKey: string | null;
  state: CredentialState;
  fields: Record<string, unknown>;
  returnReason: string | null;
  /** E-mail of the demo user who uploaded and submitted it. */
  submittedBy: string;
  submittedAt: Date;
  decidedAt: Date | null;
  /** The newer credential that replaced this one (superseded only). */
  supersededBy?: string;
  document: DemoDocument;
}

export interface DemoWorld {
  today: string;
  companies: DemoCompany[];
  technicians: DemoTechnician[];
  credentials: DemoCredential[];
}
