export const reviewKeys = {
  all: ["reviews"] as const,
  workOrder: (workOrderId: number) => [...reviewKeys.all, "work-order", workOrderId] as const,
};
