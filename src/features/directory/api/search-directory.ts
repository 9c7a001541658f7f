import { infiniteQueryOptions, keepPreviousData, useInfiniteQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { directoryKeys } from "./directory-keys.ts";
import { directoryPageDtoSchema } from "@shared/directory/directory-shapes.ts";

/** One page of results for a query string built from the URL's filters. */
export const searchDirectory = (search: string, cursor: string | null) => {
  const query = new URLSearchParams(search);
  if (cursor) query.set("cursor", cursor);
  const text = query.toString();
  return api.get(text ? `/directory?${text}` : "/directory", directoryPageDtoSchema);
};

export const directorySearchQuery = (search: string) =>
  infiniteQueryOptions({
    queryKey: directoryKeys.search(search),
    queryFn: ({ pageParam }) => searchDirectory(search, pageParam),
    initialPageParam: null as string | null,
    getNextPageParam: (last) => last.nextCursor,
  });

/** Keeps the previous results on screen while a changed search loads, so the page does not jump. */
export const useDirectorySearch = (search: string) =>
  useInfiniteQuery({ ...directorySearchQuery(search), placeholderData: keepPreviousData });
