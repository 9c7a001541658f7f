import type { TechnicianDto } from "../../shared/technicians/schemas.ts";
import type { Technician } from "./model.ts";

export function toTechnicianDto(t: Technician, companyName: string, hasAccount: boolean): TechnicianDto {
  return {
    id: t.id,
    companyId: t.companyId,
    companyName,
    name: t.name,
    email: t.email,
    phone: t.phone,
    technologies: t.technologies,
    controlFamilies: t.controlFamilies,
    postalCode: t.postalCode,
    latitude: t.latitude,
    longitude: t.longitude,
    serviceRadiusKm: t.serviceRadiusKm,
    hourlyRateCents: t.hourlyRateCents,
    travelRateCents: t.travelRateCents,
    mileageRateCents: t.mileageRateCents,
    active: t.active,
    hasAccount,
  };
}
