import type { EquipmentDto, SiteDto } from "../../shared/sites/schemas.ts";
import { lookupPostalCode } from "../geo/index.ts";
import type { Equipment, Site } from "./model.ts";

export function toSiteDto(site: Site, equipmentCount: number): SiteDto {
  const place = lookupPostalCode(site.postalCode);
  return {
    id: site.id,
    companyId: site.companyId,
    name: site.name,
    addressLine: site.addressLine,
    postalCode: site.postalCode,
    city: place?.city ?? null,
    state: place?.state ?? null,
    timeZone: site.timeZone,
    latitude: site.latitude,
    longitude: site.longitude,
    contactName: site.contactName ?? null,
    contactPhone: site.contactPhone ?? null,
    safetyInductionNote: site.safetyInductionNote ?? null,
    defaultPoNumber: site.defaultPoNumber ?? null,
    defaultNotToExceedCents: site.defaultNotToExceedCents ?? null,
    active: site.active,
    equipmentCount,
    createdAt: site.createdAt.toISOString(),
    updatedAt: site.updatedAt.toISOString(),
  };
}

export function toEquipmentDto(e: Equipment): EquipmentDto {
  return {
    id: e.id,
    siteId: e.siteId,
    builder: e.builder,
    controlFamily: e.controlFamily,
    technology: e.technology,
    model: e.model,
    serialNumber: e.serialNumber,
    yearBuilt: e.yearBuilt ?? null,
    inServiceOn: e.inServiceOn ?? null,
    building: e.building ?? null,
    bay: e.bay ?? null,
    notes: e.notes ?? null,
    state: e.state ?? "running",
  };
}
