import { useMutation, useQueryClient } from "@tanstack/react-query";
import { markedReadDtoSchema } from "@shared/notices/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { noticeKeys } from "./notice-keys.ts";

export const markAllNotificationsRead = () =>
  api.post("/notifications/read-all", undefined, markedReadDtoSchema);

export function useMarkAllNotificationsRead() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: markAllNotificationsRead,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: noticeKeys.all }),
  });
}
