export const siteKeys = {
  all: ["sites"] as const,
  list: () => [...siteKeys.all, "list"] as const,
  equipment: (siteId: number) => [...siteKeys.all, "equipment", siteId] as const,
  postalPlace: (code: string) => [...siteKeys.all, "postal-place", code] as const,
};
