import { QueryClient } from "@tanstack/react-query";
import { isApiError } from "./api-client.ts";

// A 4xx answer will not change on retry; only network trouble and 5xx are worth a second try.
const shouldRetry = (failureCount: number, error: unknown): boolean =>
  failureCount < 2 && !(isApiError(error) && error.status >= 400 && error.status < 500);

export const queryClient = new QueryClient({
  defaultOptions: {
    queries: { staleTime: 30_000, retry: shouldRetry, refetchOnWindowFocus: false },
    mutations: { retry: false },
  },
});
