export const technicianKeys = {
  all: ["technicians"] as const,
  list: () => [...technicianKeys.all, "list"] as const,
  detail: (id: number) => [...technicianKeys.all, "detail", id] as const,
};
