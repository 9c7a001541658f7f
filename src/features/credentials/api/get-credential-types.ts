import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";
import { credentialKeys } from "./credential-keys.ts";
import { credentialTypeSchema } from "./credential-shapes.ts";

export const getCredentialTypes = () => api.get("/credential-types", z.array(credentialTypeSchema));

// The catalogue changes only when an admin edits it.
export const credentialTypesQuery = () =>
  queryOptions({ queryKey: credentialKeys.types(), queryFn: getCredentialTypes, staleTime: 5 * 60_000 });

export const useCredentialTypes = () => useQuery(credentialTypesQuery());
