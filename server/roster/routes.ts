import { z } from "zod";
import {
  addRosterEntrySchema,
  rosterEntryDtoSchema,
  rosterEntryParamsSchema,
} from "../../shared/roster/schemas.ts";
import { createRoutes } from "../http/route.ts";
import { rosterToCsv } from "./csv-export.ts";
import { canKeepRoster, canRemoveRosterEntry } from "./policy.ts";
import { addToRoster, listRoster, removeFromRoster } from "./service.ts";

export const rosterRoutes = createRoutes("/api/roster");

rosterRoutes.get("", { allow: canKeepRoster, response: z.array(rosterEntryDtoSchema) }, (req) =>
  listRoster(req.user!.companyId),
);

rosterRoutes.get("/export.csv", { allow: canKeepRoster }, async (req, res) => {
  const csv = rosterToCsv(await listRoster(req.user!.companyId));
  res.type("text/csv; charset=utf-8").attachment("roster.csv").send(csv);
});

rosterRoutes.post(
  "",
  { allow: canKeepRoster, body: addRosterEntrySchema, response: rosterEntryDtoSchema, status: 201 },
  (req, _res, { body }) => addToRoster(req.user!, body),
);

rosterRoutes.delete(
  "/:entryId",
  { allow: canRemoveRosterEntry, params: rosterEntryParamsSchema },
  async (req, _res, { params }) => {
    await removeFromRoster(req.user!, params.entryId);
  },
);
