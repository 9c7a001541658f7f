import type { Response } from "express";
import { AppError } from "../http/app-error.ts";
import { findWorkOrder } from "./find-work-orders.ts";
import { renderStandingProof } from "./standing-proof-page.ts";
import { onSiteLines } from "../../shared/work-orders/on-site-lines.ts";

/** The printable proof: both snapshots, or only the one asked for. */
export async function sendStandingProof(
  user: Express.User,
  id: number,
  at: "accepted" | "completed" | undefined,
  res: Response,
) {
  const wo = await findWorkOrder(user, id);
  const snapshots = [
    ...(wo.snapshotAccepted && at !== "completed"
      ? [{ title: "When the technician accepted", snapshot: wo.snapshotAccepted }]
      : []),
    ...(wo.snapshotCompleted && at !== "accepted"
      ? [{ title: "When the work was completed", snapshot: wo.snapshotCompleted }]
      : []),
  ];
  if (at && snapshots.length === 0)
    throw new AppError("not_found", `No snapshot was taken when the work order was ${at}`);
  res.setHeader("Content-Type", "text/html; charset=utf-8");
  // Nothing in the page may run or load: inline style only.
  res.setHeader("Content-Security-Policy", "default-src 'none'; style-src 'unsafe-inline'; font-src 'self'");
  res.setHeader("X-Content-Type-Options", "nosniff");
  res.setHeader("Cache-Control", "private, no-store");
  res.send(
    renderStandingProof(
      {
        workOrderId: wo.id,
        shopName: wo.shop.name,
        siteName: wo.site.name,
        technology: wo.technology,
        // A site always has a zone; UTC (named as such) only if its row is gone.
        timeZone: wo.site.timeZone ?? "UTC",
        ...(wo.onSite ? { onSite: onSiteLines(wo.onSite), arrivalAt: wo.arrivalAt } : {}),
      },
      snapshots,
    ),
  );
}
