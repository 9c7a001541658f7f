import { useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { postalCodeSchema } from "@shared/accounts/schemas.ts";
import { api } from "@/lib/api-client.ts";

const zipPlaceSchema = z.object({
  postalCode: z.string(),
  city: z.string(),
  state: z.string(),
  timeZone: z.string(),
});
export type ZipPlace = z.infer<typeof zipPlaceSchema>;

export const lookUpZipZone = (zip: string) => api.get(`/geo/zip/${zip}`, zipPlaceSchema);

/** The place and the zone a new company would get from this ZIP, once it has five digits (public, rate-limited). */
export const useZipZone = (zip: string) =>
  useQuery({
    queryKey: ["geo", "zip", zip],
    queryFn: () => lookUpZipZone(zip),
    enabled: postalCodeSchema.safeParse(zip).success,
    staleTime: Infinity,
    retry: false,
  });
