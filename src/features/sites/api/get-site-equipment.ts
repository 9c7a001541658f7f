import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";
import { siteKeys } from "./site-keys.ts";
import { equipmentDtoSchema } from "@shared/sites/schemas.ts";

export const getSiteEquipment = (siteId: number) =>
  api.get(`/sites/${siteId}/equipment`, z.array(equipmentDtoSchema));

export const siteEquipmentQuery = (siteId: number) =>
  queryOptions({ queryKey: siteKeys.equipment(siteId), queryFn: () => getSiteEquipment(siteId) });

/** The machines of one site; idle until a site is chosen. */
export const useSiteEquipment = (siteId: number | null) =>
  useQuery({ ...siteEquipmentQuery(siteId ?? 0), enabled: siteId !== null });
