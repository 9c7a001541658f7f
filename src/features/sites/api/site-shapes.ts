import { z } from "zod";

// Run-time check of shared/sites/schemas.ts PostalPlaceDto (the ZIP lookup, declared with the geo answers).
export const postalPlaceSchema = z.object({
  postalCode: z.string(),
  city: z.string(),
  state: z.string(),
  latitude: z.number(),
  longitude: z.number(),
  timeZone: z.string().nullable(),
});
export type PostalPlace = z.infer<typeof postalPlaceSchema>;
