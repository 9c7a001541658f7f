export const adminKeys = {
  all: ["admin"] as const,
  users: () => [...adminKeys.all, "users"] as const,
  companies: () => [...adminKeys.all, "companies"] as const,
  outbox: () => [...adminKeys.all, "outbox"] as const,
};
