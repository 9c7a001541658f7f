import { z } from "zod";
import { singleLineText } from "../api/text.ts";

export const roles = ["provider_admin", "technician", "reviewer", "buyer", "admin"] as const;
export type Role = (typeof roles)[number];
export const roleSchema = z.enum(roles);

export const companyKinds = ["service", "shop", "platform"] as const;
export type CompanyKind = (typeof companyKinds)[number];

// bcrypt reads only the first 72 bytes, so longer passwords are refused rather than silently cut.
export const passwordSchema = singleLineText()
  .min(10, "Use at least 10 characters")
  .max(72, "Use at most 72 characters")
  .refine((p) => new TextEncoder().encode(p).length <= 72, "Use at most 72 bytes");

export const emailSchema = z
  .email("Enter a valid e-mail address")
  .max(254)
  .transform((e) => e.toLowerCase());

export const signInSchema = z.object({
  email: emailSchema,
  password: singleLineText().min(1, "Enter your password").max(200),
});
export type SignIn = z.infer<typeof signInSchema>;

export const timeZoneSchema = singleLineText()
  .min(1)
  .max(64)
  .refine((tz) => {
    try {
      new Intl.DateTimeFormat("en-US", { timeZone: tz });
      return true;
    } catch {
      return false;
    }
  }, "Unknown IANA time zone");

export const postalCodeSchema = singleLineText().regex(/^\d{5}$/, "Enter a 5-digit ZIP code");

/**
 * A policy period runs on standard time at the named insured's mailing address (the standard CGL declarations: "12:01
 * A.M. standard time at your mailing address", wording from memory), so a company's zone is derived from its ZIP code and changes only with
 * the address; a zone sent on its own is refused.
 */
export const zoneFollowsPostalCode = z
  .unknown()
  .refine(
    (value) => value === undefined,
    "The time zone follows the ZIP code; change the mailing address instead",
  )
  .optional();

export const signUpSchema = z.object({
  kind: z.enum(["service", "shop"]),
  companyName: singleLineText().trim().min(2, "Enter the company's legal name").max(160),
  addressLine: singleLineText().trim().min(3, "Enter the mailing address").max(200),
  postalCode: postalCodeSchema,
  timeZone: zoneFollowsPostalCode,
  name: singleLineText().trim().min(2, "Enter your name").max(120),
  email: emailSchema,
  password: passwordSchema,
});
export type SignUp = z.infer<typeof signUpSchema>;

/** A company's mailing address; its time zone is derived from the ZIP code. */
export const companyAddressSchema = z.object({
  addressLine: singleLineText().trim().min(3, "Enter the mailing address").max(200),
  postalCode: postalCodeSchema,
  timeZone: zoneFollowsPostalCode,
});
export type CompanyAddress = z.infer<typeof companyAddressSchema>;

export const companyProfileDtoSchema = z.object({
  id: z.number(),
  name: z.string(),
  kind: z.enum(companyKinds),
  addressLine: z.string().nullable(),
  postalCode: z.string().nullable(),
  city: z.string().nullable(),
  state: z.string().nullable(),
  /** Derived from the ZIP code; shown, never chosen. */
  timeZone: z.string(),
});
export type CompanyProfileDto = z.infer<typeof companyProfileDtoSchema>;

export const requestPasswordResetSchema = z.object({ email: emailSchema });
export type RequestPasswordReset = z.infer<typeof requestPasswordResetSchema>;

/** The same words whether or not the address has an account, so the answer cannot be used to probe for accounts. */
export const passwordResetAnswerSchema = z.object({ message: z.string() });

export const setPasswordSchema = z.object({
  token: singleLineText().min(20).max(200),
  password: passwordSchema,
});
export type SetPassword = z.infer<typeof setPasswordSchema>;

export const inviteUserSchema = z.object({
  email: emailSchema,
  name: singleLineText().trim().min(2).max(120),
  role: roleSchema,
  companyId: z.coerce.number().int().positive(),
});
export type InviteUser = z.infer<typeof inviteUserSchema>;

export const userParamsSchema = z.object({
  userId: z.coerce.number().int().positive().max(2_147_483_647),
});

/** Invited: has not chosen a password yet. Deactivated: may not sign in, and every session of theirs has ended. */
export const userStatuses = ["invited", "active", "deactivated"] as const;
export type UserStatus = (typeof userStatuses)[number];

export const adminUserDtoSchema = z.object({
  id: z.number(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  companyId: z.number(),
  companyName: z.string(),
  status: z.enum(userStatuses),
});
export type AdminUserDto = z.infer<typeof adminUserDtoSchema>;

/** The account an invitation just opened: who it is for, before they set a password. */
export const invitedUserDtoSchema = adminUserDtoSchema.pick({
  id: true,
  email: true,
  name: true,
  role: true,
  companyId: true,
});
export type InvitedUserDto = z.infer<typeof invitedUserDtoSchema>;

export const adminCompanyDtoSchema = companyProfileDtoSchema
  .pick({ id: true, name: true, kind: true })
  .extend({
    createdAt: z.string(),
    users: z.number(),
    technicians: z.number(),
    sites: z.number(),
  });
export type AdminCompanyDto = z.infer<typeof adminCompanyDtoSchema>;

export const currentUserSchema = z.object({
  id: z.number(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  companyId: z.number(),
  companyName: z.string(),
  companyKind: z.enum(companyKinds),
  technicianId: z.number().nullable(),
});
export type CurrentUser = z.infer<typeof currentUserSchema>;

export const caughtMailSchema = z.object({
  id: z.number(),
  from: z.string(),
  to: z.string(),
  subject: z.string(),
  text: z.string(),
  receivedAt: z.string(),
});
export type CaughtMail = z.infer<typeof caughtMailSchema>;
