import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { accountKeys } from "./account-keys.ts";

export const signOut = () => api.send("POST", "/auth/sign-out");

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      queryClient.clear();
      queryClient.setQueryData(accountKeys.currentUser(), null);
    },
  });
}
