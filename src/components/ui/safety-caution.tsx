import {
  CLEARED_MEANS,
  LICENSE_CAUTION,
  RIGGING_CAUTION,
  SAFETY_CAUTIONS,
  SAFETY_CAUTION_TITLE,
} from "@shared/safety/cautions.ts";
import { Caution } from "./caution.tsx";

const POINTS = [...SAFETY_CAUTIONS, LICENSE_CAUTION, RIGGING_CAUTION];

/** What "Cleared" means and the safety rules it never replaces, where work on a machine is decided. */
export function SafetyCaution({ className = "" }: { className?: string }) {
  return (
    <Caution
      label={SAFETY_CAUTION_TITLE}
      title={`${SAFETY_CAUTION_TITLE}.`}
      lead={CLEARED_MEANS}
      points={POINTS}
      moreLabel="The safety rules it never replaces"
      className={className}
    />
  );
}
