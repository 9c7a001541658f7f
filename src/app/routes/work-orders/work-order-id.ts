import { data } from "react-router-dom";
import { idParam } from "@shared/credentials/schemas.ts";

/** The work order id from the URL, or a 404 page for anything that is not one. */
export function workOrderIdOf(params: { workOrderId?: string | undefined }): number {
  const parsed = idParam.safeParse(params.workOrderId);
  if (!parsed.success) throw data("There is no work order at this address.", { status: 404 });
  return parsed.data;
}
