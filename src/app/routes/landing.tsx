import { redirect } from "react-router-dom";
import { homePathByRole } from "@/config/navigation.ts";
import { paths } from "@/config/paths.ts";
import { currentUserQuery } from "@/features/accounts/api/get-current-user.ts";
import { queryClient } from "@/lib/query-client.ts";

/** "/" has no page of its own: each role starts on its own home, everyone else on sign-in. */
export async function loader() {
  const user = await queryClient.ensureQueryData(currentUserQuery());
  return redirect(user ? homePathByRole[user.role] : paths.auth.signIn);
}

export function Component() {
  return null;
}
