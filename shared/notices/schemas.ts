import { z } from "zod";
import { idParam } from "../credentials/schemas.ts";

export const notificationParamsSchema = z.object({ notificationId: idParam });

export const listNotificationsQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(200).default(50),
});

export const notificationKinds = ["credential_lapsing", "credential_lapsed"] as const;

export interface NotificationDto {
  id: number;
  kind: string;
  title: string;
  body: string;
  link: string | null;
  readAt: string | null;
  createdAt: string;
}

export interface NotificationListDto {
  unreadCount: number;
  notifications: NotificationDto[];
}
