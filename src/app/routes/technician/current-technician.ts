import { data } from "react-router-dom";
import { currentUserQuery } from "@/features/accounts/api/get-current-user.ts";
import { queryClient } from "@/lib/query-client.ts";

/** The technician record linked to the signed-in user; a technician sign-in without one cannot use these pages. */
export async function currentTechnicianId(): Promise<number> {
  const user = await queryClient.ensureQueryData(currentUserQuery());
  if (!user?.technicianId)
    throw data("Your sign-in is not linked to a technician record. Ask your office to link it.", {
      status: 403,
    });
  return user.technicianId;
}
