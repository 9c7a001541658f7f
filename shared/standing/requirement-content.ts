import type { CredentialTypeDefinition } from "../credentials/catalogue.ts";
import type { CredentialFields, LimitName } from "../credentials/credential-fields.ts";
import type { Requirement } from "./requirements.ts";
import type { UnmetReason } from "./standing-types.ts";

export interface ContentProblem {
  reason: Extract<UnmetReason, "below_limit" | "flag_absent" | "wrong_control_family" | "below_level">;
  detail: string;
}

const dollars = new Intl.NumberFormat("en-US");

function limitWords(name: LimitName): string {
  return name.replace(/([A-Z])/g, " $1").toLowerCase();
}

function sameName(a: string, b: string): boolean {
  return a.trim().localeCompare(b.trim(), "en", { sensitivity: "base" }) === 0;
}

/**
 * What the document itself fails to show, whatever its dates. Limits and flags apply to insurance only: a state
 * exemption that satisfies a workers' comp line has no insurer, so no limit and nothing to subrogate. Builder,
 * control family and level apply to machine-builder training only.
 */
export function findContentProblem(
  requirement: Requirement,
  type: CredentialTypeDefinition,
  fields: CredentialFields,
): ContentProblem | null {
  if (type.fieldSet === "insurance" && "limits" in fields) {
    for (const [name, minimum] of Object.entries(requirement.minLimits ?? {}) as [LimitName, number][]) {
      const shown = fields.limits[name];
      if (shown === undefined || shown < minimum) {
        const shownText = shown === undefined ? "not shown" : dollars.format(shown);
        return {
          reason: "below_limit",
          detail: `${type.name}: ${limitWords(name)} is ${shownText}; this site requires ${dollars.format(minimum)}.`,
        };
      }
    }
    if (requirement.additionalInsured && !fields.additionalInsured) {
      return { reason: "flag_absent", detail: `${type.name} does not show the site as additional insured.` };
    }
    if (requirement.waiverOfSubrogation && !fields.waiverOfSubrogation) {
      return { reason: "flag_absent", detail: `${type.name} does not show a waiver of subrogation.` };
    }
  }
  const wantsOem =
    requirement.builder !== undefined ||
    requirement.controlFamily !== undefined ||
    requirement.minLevel !== undefined;
  if (!wantsOem) return null;
  if (!("controlFamily" in fields)) {
    return { reason: "wrong_control_family", detail: `${type.name} is not machine-builder training.` };
  }
  if (requirement.builder !== undefined && !sameName(requirement.builder, fields.builder)) {
    return {
      reason: "wrong_control_family",
      detail: `Training is from ${fields.builder}; this site requires ${requirement.builder}.`,
    };
  }
  if (requirement.controlFamily !== undefined && !sameName(requirement.controlFamily, fields.controlFamily)) {
    return {
      reason: "wrong_control_family",
      detail: `Training covers the ${fields.controlFamily} control family; this site requires ${requirement.controlFamily}.`,
    };
  }
  if (requirement.minLevel !== undefined && fields.level < requirement.minLevel) {
    return {
      reason: "below_level",
      detail: `Training is level ${fields.level}; this site requires level ${requirement.minLevel} or higher.`,
    };
  }
  return null;
}
