import QRCode from "qrcode";
import { z } from "zod";
import { singleLineText } from "../../shared/api/text.ts";
import { badgeDtoSchema, badgePhotoSavedDtoSchema, gateSignDtoSchema } from "../../shared/gate/badge.ts";
import { gateSecret, publicUrl } from "../config.ts";
import { abuseLimit } from "../accounts/abuse-limits.ts";
import { appConfig } from "../http/app-locals.ts";
import { anyone, requireOwnership, requireRole } from "../http/policy.ts";
import { createRoutes } from "../http/route.ts";
import { isOwnSite } from "../sites/policy.ts";
import { notFound } from "../http/app-error.ts";
import { checkAtGate } from "./check.ts";
import { listGateChecks } from "./check-log.ts";
import { gateCheckLogQuerySchema, gateCheckLogSchema } from "../../shared/gate/check-log.ts";
import { gateCheckDtoSchema } from "../../shared/gate/check-answer.ts";
import { saveTechnicianPhoto, technicianPhotoDataUrl } from "./photo.ts";
import { singleFileUpload } from "../http/upload.ts";
import { BADGE_TOKEN_TTL_MS, issueBadgeToken, siteGateCode } from "./token.ts";
import { Site } from "../db/models.ts";

export const gateRoutes = createRoutes("/api");

const tokenText = singleLineText()
  .trim()
  .min(1, "Scan the badge again")
  .max(200, "Not a badge code")
  .regex(/^[A-Za-z0-9._-]+$/, "Not a badge code");
const siteCodeText = singleLineText()
  .trim()
  .regex(/^[0-9]{1,10}-[A-Za-z0-9_-]{10}$/, "Not a site code from a gate sign")
  .optional();

/** Only the technician holds their own badge: an office admin showing it would be a badge without a person. */
const canShowOwnBadge = requireRole("technician");

gateRoutes.get(
  "/badge",
  { allow: canShowOwnBadge, query: z.object({ site: siteCodeText }), response: badgeDtoSchema },
  async (req, _res, { query }) => {
    const config = appConfig(req);
    const issuedAt = new Date();
    const token = issueBadgeToken(gateSecret(config), req.user!.technicianId!, issuedAt);
    const url = new URL("/gate/check", publicUrl(config));
    url.searchParams.set("token", token);
    if (query.site) url.searchParams.set("site", query.site);
    // Error correction M and a 4-module quiet zone so a phone camera at arm's length reads it (ISO/IEC 18004 §7.5, §6.3.8).
    const png = await QRCode.toDataURL(url.toString(), { errorCorrectionLevel: "M", margin: 4, width: 320 });
    return {
      url: url.toString(),
      qrPng: png,
      photo: await technicianPhotoDataUrl(req.user!.technicianId!),
      issuedAt: issuedAt.toISOString(),
      expiresAt: new Date(issuedAt.getTime() + BADGE_TOKEN_TTL_MS).toISOString(),
    };
  },
);

gateRoutes.get(
  "/gate/check",
  {
    allow: anyone,
    before: [abuseLimit("gateCheck")],
    query: z.object({ token: tokenText, site: siteCodeText }),
    response: gateCheckDtoSchema,
  },
  (req, _res, { query }) => checkAtGate(gateSecret(appConfig(req)), query.token, query.site),
);

gateRoutes.post(
  "/badge/photo",
  { allow: canShowOwnBadge, before: [singleFileUpload], response: badgePhotoSavedDtoSchema },
  (req) => saveTechnicianPhoto(req.user!.technicianId!, req.file),
);

const canPrintGateSign = requireOwnership(
  requireRole("buyer"),
  "a site of the buyer's shop",
  (user, params) => isOwnSite(user, params.siteId),
);

gateRoutes.get(
  "/sites/:siteId/gate-sign",
  {
    allow: canPrintGateSign,
    params: z.object({ siteId: z.coerce.number().int().positive() }),
    response: gateSignDtoSchema,
  },
  async (req, _res, { params }) => {
    const site = await Site.findByPk(params.siteId, { attributes: ["id", "name"] });
    if (!site) throw notFound("That site");
    const config = appConfig(req);
    const code = siteGateCode(gateSecret(config), site.id);
    const badgeUrl = new URL("/badge", publicUrl(config));
    badgeUrl.searchParams.set("site", code);
    const qrPng = await QRCode.toDataURL(badgeUrl.toString(), {
      errorCorrectionLevel: "M",
      margin: 4,
      width: 320,
    });
    return { siteName: site.name, code, badgeUrl: badgeUrl.toString(), qrPng };
  },
);

// The shop sees the checks at its own sites only, never the same technician's checks at other shops.
gateRoutes.get(
  "/gate/checks",
  {
    allow: requireRole("provider_admin", "buyer"),
    query: gateCheckLogQuerySchema,
    response: gateCheckLogSchema,
  },
  (req, _res, { query }) => listGateChecks(req.user!, query),
);
