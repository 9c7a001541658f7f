export const standingKeys = {
  all: ["standing"] as const,
  technician: (technicianId: number) => [...standingKeys.all, "technician", technicianId] as const,
};
