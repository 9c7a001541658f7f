import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { adminKeys } from "./admin-keys.ts";
import { adminUserDtoSchema } from "@shared/accounts/schemas.ts";

/** Deactivating ends every session of that user at once; reactivating lets them sign in again. */
export const setUserActive = ({ userId, active }: { userId: number; active: boolean }) =>
  api.post(`/admin/users/${userId}/${active ? "reactivate" : "deactivate"}`, {}, adminUserDtoSchema);

export function useSetUserActive() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setUserActive,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: adminKeys.all }),
  });
}
