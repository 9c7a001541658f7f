import { queryOptions, useQuery } from "@tanstack/react-query";
import {
  notificationListDtoSchema,
  type NotificationDto,
  type NotificationListDto,
} from "@shared/notices/schemas.ts";
import { api, isApiError } from "@/lib/api-client.ts";
import { noticeKeys } from "./notice-keys.ts";

export type Notification = NotificationDto;
export type Notifications = NotificationListDto;

const none: Notifications = { notifications: [], unreadCount: 0 };

/** The signed-in user's notifications; an empty list while the notices service is not there yet (404). */
export async function getNotifications(): Promise<Notifications> {
  try {
    return await api.get("/notifications", notificationListDtoSchema);
  } catch (error) {
    if (isApiError(error) && error.status === 404) return none;
    throw error;
  }
}

export const notificationsQuery = () =>
  // Checked once a minute so a lapse warning shows up without a reload.
  queryOptions({ queryKey: noticeKeys.list(), queryFn: getNotifications, refetchInterval: 60_000 });

export const useNotifications = () => useQuery(notificationsQuery());
