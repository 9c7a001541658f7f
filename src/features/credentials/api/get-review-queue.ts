import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import type { QueueQuery } from "@shared/credentials/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { credentialKeys } from "./credential-keys.ts";
import { queuePageDtoSchema } from "@shared/credentials/credential-shapes.ts";

export function getReviewQueue(query: Partial<QueueQuery>) {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== "") search.set(key, String(value));
  }
  const text = search.toString();
  return api.get(`/review/queue${text ? `?${text}` : ""}`, queuePageDtoSchema);
}

export const reviewQueueQuery = (query: Partial<QueueQuery>) =>
  queryOptions({
    queryKey: credentialKeys.queue(query),
    queryFn: () => getReviewQueue(query),
    staleTime: 0,
    // Keep the old page on screen while the next sort or page loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });

export const useReviewQueue = (query: Partial<QueueQuery>) => useQuery(reviewQueueQuery(query));
