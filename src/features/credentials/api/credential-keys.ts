import type { QueueQuery } from "@shared/credentials/schemas.ts";

export type CredentialFilters = {
  technicianId?: number | undefined;
  state?: string | undefined;
  holder?: "company" | "technician" | undefined;
};

/** Keys from general to specific, so `credentialKeys.all` refreshes every list, detail and the queue at once. */
export const credentialKeys = {
  all: ["credentials"] as const,
  types: () => [...credentialKeys.all, "types"] as const,
  lists: () => [...credentialKeys.all, "list"] as const,
  list: (filters: CredentialFilters) => [...credentialKeys.lists(), filters] as const,
  detail: (id: number) => [...credentialKeys.all, "detail", id] as const,
  queues: () => [...credentialKeys.all, "queue"] as const,
  queue: (query: Partial<QueueQuery>) => [...credentialKeys.queues(), query] as const,
  brokerUpload: (token: string) => [...credentialKeys.all, "broker-upload", token] as const,
};
