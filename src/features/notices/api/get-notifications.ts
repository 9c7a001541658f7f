import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { api, isApiError } from "@/lib/api-client.ts";
import { noticeKeys } from "./notice-keys.ts";

const notificationSchema = z.object({
  id: z.number(),
  kind: z.string(),
  title: z.string(),
  body: z.string(),
  link: z.string().nullable(),
  readAt: z.string().nullable(),
  createdAt: z.string(),
});
export type Notification = z.infer<typeof notificationSchema>;

// shared/notices/schemas.ts NotificationListDto
const notificationsSchema = z.object({ notifications: z.array(notificationSchema), unreadCount: z.number() });
export type Notifications = z.infer<typeof notificationsSchema>;

const none: Notifications = { notifications: [], unreadCount: 0 };

/** The signed-in user's notifications; an empty list while the notices service is not there yet (404). */
export async function getNotifications(): Promise<Notifications> {
  try {
    return await api.get("/notifications", notificationsSchema);
  } catch (error) {
    if (isApiError(error) && error.status === 404) return none;
    throw error;
  }
}

export const notificationsQuery = () =>
  // Checked once a minute so a lapse warning shows up without a reload.
  queryOptions({ queryKey: noticeKeys.list(), queryFn: getNotifications, refetchInterval: 60_000 });

export const useNotifications = () => useQuery(notificationsQuery());
