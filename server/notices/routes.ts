import {
  listNotificationsQuerySchema,
  markedReadDtoSchema,
  notificationDtoSchema,
  notificationListDtoSchema,
  notificationParamsSchema,
} from "../../shared/notices/schemas.ts";
import { signedIn } from "../http/policy.ts";
import { createRoutes } from "../http/route.ts";
import { listOwnNotifications, markAllNotificationsRead, markNotificationRead } from "./notifications.ts";

export const noticeRoutes = createRoutes("/api/notifications");

// Every signed-in user reads only their own notifications: the service scopes each query by the reader.
const canReadOwnNotifications = signedIn;

noticeRoutes.get(
  "",
  {
    allow: canReadOwnNotifications,
    query: listNotificationsQuerySchema,
    response: notificationListDtoSchema,
  },
  (req, _res, { query }) => listOwnNotifications(req.user!, query.limit),
);

noticeRoutes.post("/read-all", { allow: canReadOwnNotifications, response: markedReadDtoSchema }, (req) =>
  markAllNotificationsRead(req.user!),
);

noticeRoutes.post(
  "/:notificationId/read",
  { allow: canReadOwnNotifications, params: notificationParamsSchema, response: notificationDtoSchema },
  (req, _res, { params }) => markNotificationRead(req.user!, params.notificationId),
);
