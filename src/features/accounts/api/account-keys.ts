export const accountKeys = {
  all: ["accounts"] as const,
  currentUser: () => [...accountKeys.all, "current-user"] as const,
};
