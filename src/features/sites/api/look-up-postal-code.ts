import { useQuery } from "@tanstack/react-query";
import { postalCodeSchema } from "@shared/accounts/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { siteKeys } from "./site-keys.ts";
import { postalPlaceDtoSchema } from "@shared/geo/schemas.ts";

export const lookUpPostalCode = (code: string) => api.get(`/postal-codes/${code}`, postalPlaceDtoSchema);

/** The place and suggested time zone for a ZIP code, once it has five digits (offline dataset on the server). */
export const usePostalPlace = (code: string) =>
  useQuery({
    queryKey: siteKeys.postalPlace(code),
    queryFn: () => lookUpPostalCode(code),
    enabled: postalCodeSchema.safeParse(code).success,
    staleTime: Infinity,
  });
