import { queryOptions, useQuery } from "@tanstack/react-query";
import { currentUserSchema, type CurrentUser } from "@shared/accounts/schemas.ts";
import { api, isApiError } from "@/lib/api-client.ts";
import { accountKeys } from "./account-keys.ts";

/** The signed-in user, or null when nobody is signed in (a 401 is an answer here, not an error). */
export async function getCurrentUser(): Promise<CurrentUser | null> {
  try {
    return await api.get("/auth/me", currentUserSchema);
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export const currentUserQuery = () =>
  queryOptions({ queryKey: accountKeys.currentUser(), queryFn: getCurrentUser, staleTime: 60_000 });

export const useCurrentUser = () => useQuery(currentUserQuery());
