import { User } from "../accounts/index.ts";
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
  const starterIds = [...new Set(runs.flatMap((r) => (r.startedBy === null ? [] : [r.startedBy])))];
  const starters = starterIds.length
    ? await User.findAll({ where: { id: starterIds }, attributes: ["id", "name"] })
    : [];
  const names = new Map(starters.map((u) => [u.id, u.name]));
  return runs.map((run) => toJobRunDto(run, names));
}
