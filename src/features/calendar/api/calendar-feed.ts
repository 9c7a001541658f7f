import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { calendarFeedStatusDtoSchema, createdCalendarFeedDtoSchema } from "@shared/calendar/schemas.ts";
import { api } from "@/lib/api-client.ts";

export const calendarFeedKeys = { status: ["calendar-feed"] as const };

export const calendarFeedQuery = () =>
  queryOptions({
    queryKey: calendarFeedKeys.status,
    queryFn: () => api.get("/calendar-feed", calendarFeedStatusDtoSchema),
  });

export const useCalendarFeed = () => useQuery(calendarFeedQuery());

/** Creates the feed, or replaces its address; the answer is the only time the full address is shown. */
export function useRotateCalendarFeed() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post("/calendar-feed", {}, createdCalendarFeedDtoSchema),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: calendarFeedKeys.status }),
  });
}

export function useStopCalendarFeed() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.send("DELETE", "/calendar-feed"),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: calendarFeedKeys.status }),
  });
}
