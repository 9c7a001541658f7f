import { data } from "react-router-dom";
import { idParam } from "@shared/credentials/schemas.ts";

/** The request id from the URL, or a 404 page for anything that is not one. */
export function requestIdOf(params: { requestId?: string | undefined }): number {
  const parsed = idParam.safeParse(params.requestId);
  if (!parsed.success) throw data("There is no service request at this address.", { status: 404 });
  return parsed.data;
}
