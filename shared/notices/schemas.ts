import { z } from "zod";
import { idParam } from "../credentials/schemas.ts";

export const notificationParamsSchema = z.object({ notificationId: idParam });

export const listNotificationsQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(200).default(50),
});

export const notificationKinds = ["credential_lapsing", "credential_lapsed"] as const;

export const notificationDtoSchema = z.object({
  id: z.number(),
  // Jobs and several domains write notifications (lapses, transfers, failed jobs...), so the kind stays open text.
  kind: z.string(),
  title: z.string(),
  body: z.string(),
  link: z.string().nullable(),
  readAt: z.string().nullable(),
  createdAt: z.string(),
});
export type NotificationDto = z.infer<typeof notificationDtoSchema>;

export const notificationListDtoSchema = z.object({
  unreadCount: z.number(),
  notifications: z.array(notificationDtoSchema),
});
export type NotificationListDto = z.infer<typeof notificationListDtoSchema>;

/** How many notifications "mark all read" turned read. */
export const markedReadDtoSchema = z.object({ marked: z.number() });
