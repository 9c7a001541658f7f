import { useEffect } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { accountKeys } from "@/features/accounts/api/account-keys.ts";
import { isApiError } from "@/lib/api-client.ts";

/**
 * When any request answers 401 mid-session (the session ended on the server), forget the user;
 * the signed-in layout then sends them to sign-in and back here afterwards.
 */
export function useSessionExpiry() {
  const queryClient = useQueryClient();
  useEffect(() => {
    const forget = (error: unknown) => {
      if (isApiError(error) && error.status === 401)
        queryClient.setQueryData(accountKeys.currentUser(), null);
    };
    const stopQueries = queryClient.getQueryCache().subscribe((event) => {
      if (event.type === "updated" && event.action.type === "error") forget(event.action.error);
    });
    const stopMutations = queryClient.getMutationCache().subscribe((event) => {
      if (event.type === "updated" && event.action.type === "error") forget(event.action.error);
    });
    return () => {
      stopQueries();
      stopMutations();
    };
  }, [queryClient]);
}
