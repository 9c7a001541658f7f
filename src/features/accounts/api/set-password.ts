import { useMutation } from "@tanstack/react-query";
import type { SetPassword } from "@shared/accounts/schemas.ts";
import { api } from "@/lib/api-client.ts";

/** Used by both the reset link and the invitation link (/set-password?token=...). */
export const setPassword = (input: SetPassword) => api.send("POST", "/auth/set-password", input);

export const useSetPassword = () => useMutation({ mutationFn: setPassword });
