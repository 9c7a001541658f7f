import { z } from "zod";
import { caughtMailSchema } from "../../shared/accounts/schemas.ts";
import { createRoutes } from "../http/route.ts";
import { requireRole } from "../http/policy.ts";
import { CaughtMail } from "./model.ts";

export const outboxRoutes = createRoutes("/api/admin");

const canReadOutbox = requireRole("admin");

outboxRoutes.get("/outbox", { allow: canReadOutbox, response: z.array(caughtMailSchema) }, async () => {
  const mails = await CaughtMail.findAll({ order: [["id", "DESC"]], limit: 200 });
  return mails.map((m) => ({
    id: m.id,
    from: m.fromAddress,
    to: m.toAddress,
    subject: m.subject,
    text: m.textBody,
    receivedAt: m.receivedAt.toISOString(),
  }));
});
