export { noticeRoutes } from "./routes.ts";
export { Notification, initNoticeModels } from "./model.ts";
export {
  createWarningNotices,
  findNoticeRecipients,
  queueNoticeMessages,
  type HolderCount,
} from "./lapse-notices.ts";
export { renderLapseNotice, formatLapseInstant, type NoticeRecipient } from "./lapse-email.ts";
export { tellPerson, type BellWords } from "./tell-person.ts";
