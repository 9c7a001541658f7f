import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { InviteUser } from "@shared/accounts/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { adminKeys } from "./admin-keys.ts";

export const inviteUser = (input: InviteUser) => api.send("POST", "/admin/invitations", input);

export function useInviteUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: inviteUser,
    // The invitation adds a user and queues an e-mail.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: adminKeys.all }),
  });
}
