import { useMutation, useQueryClient } from "@tanstack/react-query";
import { currentUserSchema, type SignUp } from "@shared/accounts/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { accountKeys } from "./account-keys.ts";

/** Creates the company and its first user, who is signed in by the answer. */
export const signUp = (input: SignUp) => api.post("/auth/sign-up", input, currentUserSchema);

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: (user) => {
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== accountKeys.all[0] });
      queryClient.setQueryData(accountKeys.currentUser(), user);
    },
  });
}
