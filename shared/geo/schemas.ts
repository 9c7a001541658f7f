import { z } from "zod";
import { postalCodeSchema } from "../accounts/schemas.ts";

export const zipParams = z.object({ zip: postalCodeSchema });

/** What the sign-up form shows before the account exists: the place and the zone its policy periods run on. */
export interface ZipPlaceDto {
  postalCode: string;
  city: string;
  state: string;
  timeZone: string;
}
