import { INSURANCE_CAUTION, INSURANCE_CAUTION_DETAIL } from "@shared/safety/cautions.ts";
import { Caution } from "./caution.tsx";

/** The certificate caution, only where a decision rests on a certificate of insurance. */
export function CautionNote({ className = "" }: { className?: string }) {
  return (
    <Caution
      label="About certificates of insurance"
      title="Certificates of insurance."
      lead={INSURANCE_CAUTION}
      points={INSURANCE_CAUTION_DETAIL}
      moreLabel="What a certificate does not do"
      className={className}
    />
  );
}
