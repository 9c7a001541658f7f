import { z } from "zod";
import { postalCodeSchema } from "../accounts/schemas.ts";

export const zipParams = z.object({ zip: postalCodeSchema });

/** What the sign-up form shows before the account exists: the place and the zone its policy periods run on. */
export const zipPlaceDtoSchema = z.object({
  postalCode: z.string(),
  city: z.string(),
  state: z.string(),
  timeZone: z.string(),
});
export type ZipPlaceDto = z.infer<typeof zipPlaceDtoSchema>;

/** The site form's ZIP look-up: the place, its centroid, and the zone suggested for it (null where none is known). */
export const postalPlaceDtoSchema = zipPlaceDtoSchema.extend({
  latitude: z.number(),
  longitude: z.number(),
  timeZone: z.string().nullable(),
});
export type PostalPlaceDto = z.infer<typeof postalPlaceDtoSchema>;
