export { noticeRoutes } from "./routes.ts";
export { Notification, initNoticeModels } from "./model.ts";
export { createWarningNotices, queueNoticeMessages, type HolderCount } from "./lapse-notices.ts";
export { formatLapseInstant } from "./lapse-email.ts";
export { tellPerson, type BellWords } from "./tell-person.ts";
