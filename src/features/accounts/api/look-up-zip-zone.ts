import { useQuery } from "@tanstack/react-query";
import { postalCodeSchema } from "@shared/accounts/schemas.ts";
import { zipPlaceDtoSchema, type ZipPlaceDto } from "@shared/geo/schemas.ts";
import { api } from "@/lib/api-client.ts";

export type ZipPlace = ZipPlaceDto;

export const lookUpZipZone = (zip: string) => api.get(`/geo/zip/${zip}`, zipPlaceDtoSchema);

/** The place and the zone a new company would get from this ZIP, once it has five digits (public, rate-limited). */
export const useZipZone = (zip: string) =>
  useQuery({
    queryKey: ["geo", "zip", zip],
    queryFn: () => lookUpZipZone(zip),
    enabled: postalCodeSchema.safeParse(zip).success,
    staleTime: Infinity,
    retry: false,
  });
