import { Caution } from "@/components/ui/caution.tsx";
import type { CredentialTypeDto as CredentialType } from "@shared/credentials/credential-shapes.ts";

/** The chosen type's own caution (from the catalog), shown before the file is sent. */
export function TypeCaution({ type }: { type: CredentialType }) {
  if (!type.caution) return null;
  return (
    <Caution
      label={`Caution: ${type.name}`}
      title={`${type.name}.`}
      lead={type.caution}
      points={[]}
      moreLabel=""
    />
  );
}
