import { existsSync } from "node:fs";
import path from "node:path";
import express, { type Express } from "express";
import helmet from "helmet";
import type pg from "pg";
import { publicUrl, type Config } from "./config.ts";
import { passport, renewSessionNearExpiry, sessionMiddleware } from "./http/auth.ts";
import { requireCsrfHeader } from "./http/csrf.ts";
import { requestLog } from "./http/request-log.ts";
import { apiNotFound, errorHandler } from "./http/error-handler.ts";
import { healthRoutes } from "./health/routes.ts";
import { Readiness, refuseWhileStarting } from "./health/readiness.ts";
import { authRoutes, adminUserRoutes } from "./accounts/index.ts";
import { outboxRoutes } from "./mail/index.ts";
import { technicianRoutes } from "./technicians/index.ts";
import { standingRoutes } from "./standing/index.ts";
import { noticeRoutes } from "./notices/index.ts";
import { credentialRoutes } from "./credentials/index.ts";
import { buyerRouters } from "./directory/buyer-routers.ts";
import { brokerRoutes } from "./credentials/broker-routes.ts";
import { adminJobRoutes } from "./admin/index.ts";
import { workOrderRoutes } from "./work-orders/index.ts";
import { reviewRoutes } from "./reviews/index.ts";
import { serviceRequestRoutes } from "./service-requests/index.ts";
import { companyRoutes } from "./companies/index.ts";
import { geoRoutes } from "./geo/routes.ts";
import { gateRoutes } from "./gate/routes.ts";
import { machineCatalogRoutes } from "./machines/catalog-routes.ts";
import { machineRoutes } from "./machines/machine-routes.ts";
import { machineHistoryRoutes } from "./machines/history-routes.ts";
import { machinePhotoRoutes } from "./machines/photo-routes.ts";
import { machineImportRoutes } from "./machines/import-routes.ts";
import { machineTransferRoutes, machineTransferStartRoutes } from "./machines/transfer-routes.ts";
import { maintenanceRoutes } from "./machines/maintenance-routes.ts";
import { machineDowntimeRoutes } from "./machines/downtime-routes.ts";
import { calendarRoutes } from "./calendar/routes.ts";
import { createStorage } from "./storage/index.ts";
import { createAbuseLimits } from "./accounts/abuse-limits.ts";
import { setRosterAlertLinkBase } from "./roster/index.ts";

export interface AppDeps {
  config: Config;
  sessionPool: pg.Pool;
  /** Folder of the built client; served with an index.html fallback for client routes. */
  clientDir?: string;
}

const apiRouters = [
  healthRoutes,
  authRoutes,
  adminUserRoutes,
  outboxRoutes,
  technicianRoutes,
  credentialRoutes,
  standingRoutes,
  noticeRoutes,
  workOrderRoutes,
  reviewRoutes,
  serviceRequestRoutes,
  companyRoutes,
  geoRoutes,
  gateRoutes,
  calendarRoutes,
  ...buyerRouters,
  machineCatalogRoutes,
  // Before the machine routes, so "/api/machines/import" is never read as a machine id.
  machineImportRoutes,
  machineRoutes,
  machineHistoryRoutes,
  machineDowntimeRoutes,
  machinePhotoRoutes,
  machineTransferStartRoutes,
  machineTransferRoutes,
  brokerRoutes,
  maintenanceRoutes,
  adminJobRoutes,
];

export function createApp({ config, sessionPool, clientDir }: AppDeps): Express {
  const app = express();
  app.locals.config = config;
  setRosterAlertLinkBase(publicUrl(config));
  app.locals.storage = createStorage(config.UPLOADS_DIR, config);
  app.locals.abuseLimits = createAbuseLimits(config);
  app.locals.readiness = new Readiness();
  app.disable("x-powered-by");
  if (config.NODE_ENV === "production") app.set("trust proxy", 1);

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // Uploaded PDFs are shown in the reviewer's side-by-side view from our own origin only.
          "frame-src": ["'self'", "blob:"],
          "object-src": ["'self'"],
          "img-src": ["'self'", "data:", "blob:"],
          // Only production sits behind HTTPS; elsewhere the demo is plain HTTP on a local address.
          "upgrade-insecure-requests": config.NODE_ENV === "production" ? [] : null,
        },
      },
    }),
  );
  // In production a line per successful API request costs throughput for nothing: failures (4xx, 5xx) still log.
  app.use(requestLog(config.NODE_ENV === "production"));
  app.use("/api", refuseWhileStarting);
  app.use("/api", express.json({ limit: "100kb" }));
  app.use("/api", sessionMiddleware(config, sessionPool));
  app.use("/api", passport.session());
  app.use("/api", renewSessionNearExpiry);
  app.use("/api", requireCsrfHeader);
  for (const routes of apiRouters) app.use(routes.router);
  app.use("/api", apiNotFound);

  const dist = clientDir ?? path.resolve(import.meta.dirname, "..", "dist");
  if (existsSync(path.join(dist, "index.html"))) {
    app.use(express.static(dist, { index: false, maxAge: "1h" }));
    app.get("/{*splat}", (_req, res) => res.sendFile(path.join(dist, "index.html")));
  }

  app.use(errorHandler);
  return app;
}
