export const baselineKeys = {
  all: ["baseline"] as const,
  current: () => [...baselineKeys.all, "current"] as const,
};
