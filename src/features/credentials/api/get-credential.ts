import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { credentialKeys } from "./credential-keys.ts";
import { credentialDetailDtoSchema } from "@shared/credentials/credential-shapes.ts";

export const getCredential = (id: number) => api.get(`/credentials/${id}`, credentialDetailDtoSchema);

// A reviewer must see the decision another reviewer just made, so this is never served stale.
export const credentialQuery = (id: number) =>
  queryOptions({ queryKey: credentialKeys.detail(id), queryFn: () => getCredential(id), staleTime: 0 });

export const useCredential = (id: number) => useQuery(credentialQuery(id));
