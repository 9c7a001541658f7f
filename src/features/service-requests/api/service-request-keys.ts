export const serviceRequestKeys = {
  all: ["service-requests"] as const,
  list: () => [...serviceRequestKeys.all, "list"] as const,
  detail: (id: number) => [...serviceRequestKeys.all, "detail", id] as const,
  comparison: (id: number) => [...serviceRequestKeys.all, "comparison", id] as const,
  thread: (id: number, companyId: number) => [...serviceRequestKeys.all, "thread", id, companyId] as const,
  followUp: () => [...serviceRequestKeys.all, "follow-up"] as const,
};
