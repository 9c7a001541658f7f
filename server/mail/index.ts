export { outboxRoutes } from "./routes.ts";
export { enqueueMail, deliverDueMail, kickOutbox, type MailDraft } from "./outbox.ts";
export { composeMail, type MailContent } from "./compose-mail.ts";
export { createSmtpMailer, type Mailer } from "./mailer.ts";
export { startSmtpCatcher, type SmtpCatcher, type CaughtMessage } from "./smtp-catcher.ts";
export { CaughtMail, OutboxMessage } from "./model.ts";
