import { data } from "react-router-dom";
import { idParam } from "@shared/credentials/schemas.ts";

/** The technician id from the URL (path or query), or a 404 page for anything that is not one. */
export function technicianIdOf(value: string | null | undefined): number {
  const parsed = idParam.safeParse(value);
  if (!parsed.success) throw data("There is no technician at this address.", { status: 404 });
  return parsed.data;
}
