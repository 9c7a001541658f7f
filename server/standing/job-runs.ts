import { toJobRunDto } from "./dto.ts";
import { JobRun } from "./model.ts";

export async function listJobRuns(limit = 50) {
  const runs = await JobRun.findAll({
    order: [
      ["startedAt", "DESC"],
      ["id", "DESC"],
    ],
    limit,
  });
  return runs.map(toJobRunDto);
}
