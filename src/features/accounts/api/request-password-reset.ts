import { useMutation } from "@tanstack/react-query";
import { passwordResetAnswerSchema, type RequestPasswordReset } from "@shared/accounts/schemas.ts";
import { api } from "@/lib/api-client.ts";

/** The server answers 202 whether or not the address is known, so nobody can probe for accounts. */
export const requestPasswordReset = (input: RequestPasswordReset) =>
  api.post("/auth/password-reset", input, passwordResetAnswerSchema);

export const useRequestPasswordReset = () => useMutation({ mutationFn: requestPasswordReset });
