import { Op } from "sequelize";
import type { NotificationDto, NotificationListDto } from "../../shared/notices/schemas.ts";
import { notFound } from "../http/app-error.ts";
import type { SignedInUser } from "../http/policy.ts";
import { Notification } from "./model.ts";

function toNotificationDto(n: Notification): NotificationDto {
  return {
    id: n.id,
    kind: n.kind,
    title: n.title,
    body: n.body,
    link: n.link,
    readAt: n.readAt?.toISOString() ?? null,
    createdAt: n.createdAt.toISOString(),
  };
}

export async function listOwnNotifications(user: SignedInUser, limit: number): Promise<NotificationListDto> {
  const [notifications, unreadCount] = await Promise.all([
    Notification.findAll({
      where: { userId: user.id },
      order: [
        ["createdAt", "DESC"],
        ["id", "DESC"],
      ],
      limit,
    }),
    Notification.count({ where: { userId: user.id, readAt: null } }),
  ]);
  return { unreadCount, notifications: notifications.map(toNotificationDto) };
}

/** Scoped by the reader: another user's notification answers 404, like a missing one. */
export async function markNotificationRead(user: SignedInUser, id: number): Promise<NotificationDto> {
  const notification = await Notification.findOne({ where: { id, userId: user.id } });
  if (!notification) throw notFound("That notification");
  if (!notification.readAt) await notification.update({ readAt: new Date() });
  return toNotificationDto(notification);
}

export async function markAllNotificationsRead(user: SignedInUser): Promise<{ marked: number }> {
  const [marked] = await Notification.update(
    { readAt: new Date() },
    { where: { userId: user.id, readAt: { [Op.is]: null } } },
  );
  return { marked };
}
