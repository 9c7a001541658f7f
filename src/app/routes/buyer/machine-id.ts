import { data } from "react-router-dom";
import { idParam } from "@shared/credentials/schemas.ts";

/** The machine id from the URL, or a 404 page for anything that is not one. */
export function machineIdOf(params: { machineId?: string | undefined }): number {
  const parsed = idParam.safeParse(params.machineId);
  if (!parsed.success) throw data("There is no machine at this address.", { status: 404 });
  return parsed.data;
}
