import type { JobRunDto, RequirementSetDto } from "../../shared/standing/schemas.ts";
import type { JobRun, RequirementSet } from "./model.ts";

export function toRequirementSetDto(set: RequirementSet): RequirementSetDto {
  return {
    id: set.id,
    companyId: set.companyId,
    siteId: set.siteId,
    name: set.name,
    requirements: set.requirements,
    active: set.active,
    createdAt: set.createdAt.toISOString(),
    updatedAt: set.updatedAt.toISOString(),
  };
}

export function toJobRunDto(run: JobRun, starterNames: Map<number, string> = new Map()): JobRunDto {
  return {
    id: run.id,
    job: run.job,
    asOf: run.asOf.toISOString(),
    startedAt: run.startedAt.toISOString(),
    finishedAt: run.finishedAt?.toISOString() ?? null,
    counts: run.counts,
    attempt: run.attempt,
    error: run.error,
    startedBy:
      run.startedBy === null ? null : { id: run.startedBy, name: starterNames.get(run.startedBy) ?? "" },
  };
}
