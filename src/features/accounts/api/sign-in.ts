import { useMutation, useQueryClient } from "@tanstack/react-query";
import { currentUserSchema, type SignIn } from "@shared/accounts/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { accountKeys } from "./account-keys.ts";

export const signIn = (input: SignIn) => api.post("/auth/sign-in", input, currentUserSchema);

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (user) => {
      // Whatever an earlier user left in the cache belongs to them, not to this session.
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== accountKeys.all[0] });
      queryClient.setQueryData(accountKeys.currentUser(), user);
    },
  });
}
