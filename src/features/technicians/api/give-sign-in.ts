import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { technicianKeys } from "./technician-keys.ts";

export type GiveSignInInput = { id: number; email: string };

/** Invites a sign-in of the technician's own, linked to their record; the e-mail holds a link to choose a password. */
export const giveSignIn = ({ id, email }: GiveSignInInput) =>
  api.send("POST", `/technicians/${id}/account`, { email });

export function useGiveSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: giveSignIn,
    onSuccess: (_data, { id }) => queryClient.invalidateQueries({ queryKey: technicianKeys.detail(id) }),
  });
}
