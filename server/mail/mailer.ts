import nodemailer, { type Transporter } from "nodemailer";

export interface MailToSend {
  from: string;
  to: string;
  subject: string;
  text: string;
  html?: string | null;
  /** A stable `<id@domain>` so a resend of the same outbox row carries the same Message-ID. */
  messageId?: string;
}

export interface Mailer {
  send(mail: MailToSend): Promise<void>;
  close(): void;
}

/** SMTP through nodemailer; `smtp://host:port` without TLS is what the local catcher speaks. */
export function createSmtpMailer(smtpUrl: string): Mailer {
  const url = new URL(smtpUrl);
  const secure = url.protocol === "smtps:";
  // Pooled: the outbox sends one message at a time, and a lapse day can queue thousands; one SMTP conversation per
  // message would open thousands of connections.
  const transporter: Transporter = nodemailer.createTransport({
    pool: true,
    maxConnections: 2,
    host: url.hostname,
    port: Number(url.port || (secure ? 465 : 587)),
    secure,
    ignoreTLS: !secure && (url.hostname === "127.0.0.1" || url.hostname === "localhost"),
    auth: url.username
      ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) }
      : undefined,
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 10_000,
  });
  return {
    async send(mail) {
      await transporter.sendMail({ ...mail, html: mail.html ?? undefined });
    },
    close: () => transporter.close(),
  };
}
