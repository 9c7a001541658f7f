import { z } from "zod";

/** Whether the company's calendar feed exists; its address is shown only once, when it is created. */
export const calendarFeedStatusDtoSchema = z.object({
  active: z.boolean(),
  createdAt: z.string().nullable(),
});
export type CalendarFeedStatusDto = z.infer<typeof calendarFeedStatusDtoSchema>;

export const createdCalendarFeedDtoSchema = z.object({ active: z.literal(true), url: z.string() });

export const stoppedCalendarFeedDtoSchema = z.object({ active: z.literal(false) });
