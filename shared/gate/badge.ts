import { z } from "zod";

/** The technician's badge screen: the signed link its QR code carries, the photo, and how long the code holds. */
export const badgeDtoSchema = z.object({
  url: z.string(),
  qrPng: z.string(),
  photo: z.string().nullable(),
  issuedAt: z.string(),
  expiresAt: z.string(),
});
export type BadgeDto = z.infer<typeof badgeDtoSchema>;

/** The printable sheet a shop posts at a site's gate: technicians scan it to open their badge for that site. */
export const gateSignDtoSchema = z.object({
  siteName: z.string(),
  code: z.string(),
  badgeUrl: z.string(),
  qrPng: z.string(),
});
export type GateSignDto = z.infer<typeof gateSignDtoSchema>;

/** The size the badge photo was kept at, after it was shrunk to fit. */
export const badgePhotoSavedDtoSchema = z.object({ width: z.number(), height: z.number() });
