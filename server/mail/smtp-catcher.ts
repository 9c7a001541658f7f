import { SMTPServer } from "smtp-server";
import { simpleParser, type AddressObject } from "mailparser";
import type { AddressInfo } from "node:net";

export interface CaughtMessage {
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string | null;
  messageId: string | null;
}

export interface SmtpCatcher {
  port: number;
  url: string;
  close(): Promise<void>;
}

function addressText(a: AddressObject | AddressObject[] | undefined): string {
  if (!a) return "";
  return (Array.isArray(a) ? a : [a]).map((x) => x.text).join(", ");
}

/**
 * A real SMTP server on loopback for development and tests: every message is parsed and handed to
 * `onMessage` (the app stores it for the admin's outbox page; tests collect it).
 */
export async function startSmtpCatcher(
  onMessage: (m: CaughtMessage) => Promise<void> | void,
  port = 0,
): Promise<SmtpCatcher> {
  const server = new SMTPServer({
    disabledCommands: ["STARTTLS", "AUTH"],
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((parsed) =>
          onMessage({
            from: addressText(parsed.from),
            to: addressText(parsed.to),
            subject: parsed.subject ?? "",
            text: parsed.text ?? "",
            html: typeof parsed.html === "string" ? parsed.html : null,
            messageId: parsed.messageId ?? null,
          }),
        )
        .then(
          () => callback(),
          (err: Error) => callback(err),
        );
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.server.once("error", reject);
    server.listen(port, "127.0.0.1", () => resolve());
  });
  const actual = (server.server.address() as AddressInfo).port;
  return {
    port: actual,
    url: `smtp://127.0.0.1:${actual}`,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
