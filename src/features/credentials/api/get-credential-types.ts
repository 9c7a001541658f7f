import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";
import { credentialKeys } from "./credential-keys.ts";
import { credentialTypeDtoSchema } from "@shared/credentials/credential-shapes.ts";

export const getCredentialTypes = () => api.get("/credential-types", z.array(credentialTypeDtoSchema));

// The catalogue changes only when an admin edits it.
export const credentialTypesQuery = () =>
  queryOptions({ queryKey: credentialKeys.types(), queryFn: getCredentialTypes, staleTime: 5 * 60_000 });

export const useCredentialTypes = () => useQuery(credentialTypesQuery());
