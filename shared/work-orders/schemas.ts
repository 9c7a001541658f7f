import { z } from "zod";
import { singleLineText, multiLineText } from "../api/text.ts";
import { idParam } from "../credentials/schemas.ts";
import { isoDateSchema } from "../credentials/credential-fields.ts";
import { standingSnapshotSchema } from "./standing-snapshot.ts";
import { partUsedDtoSchema, partsUsedSchema, problemAreas, workKinds } from "../machines/service-history.ts";

export const workOrderStatuses = [
  "requested",
  "accepted",
  "declined",
  "completed",
  "disputed",
  "confirmed",
  "cancelled",
] as const;
export type WorkOrderStatus = (typeof workOrderStatuses)[number];

// "down" = the machine is down: production has stopped, the most urgent call-out.
export const urgencies = ["low", "normal", "high", "down"] as const;
export type Urgency = (typeof urgencies)[number];

export const workOrderSides = ["shop", "service"] as const;
export type WorkOrderSide = (typeof workOrderSides)[number];

export const workOrderActions = ["accept", "decline", "complete", "confirm", "dispute", "cancel"] as const;
export type WorkOrderAction = (typeof workOrderActions)[number];

export const workOrderParamsSchema = z.object({ workOrderId: idParam });
export const messageFileParamsSchema = z.object({ workOrderId: idParam, messageId: idParam });

export const MAX_PREFERRED_DATES = 5;

// Not-to-exceed caps in whole cents; ten million dollars is far past any one call-out.
export const MAX_NOT_TO_EXCEED_CENTS = 1_000_000_000;

/** Digits with the usual separators and an optional extension ("(312) 555-0142 x12", "+1 312 555 0142"). */
export const phoneSchema = singleLineText()
  .trim()
  .max(40)
  .regex(
    /^\+?[0-9(][0-9 ().-]{5,30}[0-9](\s*(x|ext\.?)\s*[0-9]{1,6})?$/i,
    "Enter a phone number, e.g. (312) 555-0142",
  );

/**
 * What the technician needs to show up: where, whom to ask for, what the shop will pay up to and on which PO, and the
 * site's safety induction. The service side reads it only once it has accepted the job.
 */
export const onSiteDetailsInputSchema = z.object({
  siteContactName: singleLineText().trim().min(2, "Name the person on site").max(120).optional(),
  siteContactPhone: phoneSchema.optional(),
  poNumber: singleLineText().trim().min(1).max(40).optional(),
  notToExceedCents: z
    .number()
    .int("Whole cents only")
    .min(1, "Enter an amount above $0")
    .max(MAX_NOT_TO_EXCEED_CENTS, "At most $10,000,000")
    .optional(),
  safetyInductionNote: multiLineText().trim().max(2000).optional(),
});

/** What a buyer sends to raise a work order; the shop, the service company and the author come from the session and the rows. */
export const raiseWorkOrderSchema = z.object({
  technicianId: idParam,
  siteId: idParam,
  equipmentId: idParam.optional(),
  /** Null or absent = the platform baseline only. */
  requirementSetId: idParam.nullable().optional(),
  // Taken from the machine when one is chosen and this is left out.
  technology: singleLineText().trim().min(1).max(40).optional(),
  problem: multiLineText().trim().min(10, "Describe the problem (at least 10 characters)").max(5000),
  urgency: z.enum(urgencies).default("normal"),
  preferredDates: z
    .array(isoDateSchema)
    .max(MAX_PREFERRED_DATES, `At most ${MAX_PREFERRED_DATES} dates`)
    .default([]),
  /** For the machine's history: the kind of work and where the trouble is (repeat faults are matched on it). */
  kind: z.enum(workKinds).optional(),
  problemArea: z.enum(problemAreas).optional(),
  ...onSiteDetailsInputSchema.shape,
});
export type RaiseWorkOrder = z.infer<typeof raiseWorkOrderSchema>;

const reasonSchema = multiLineText().trim().min(5, "Say why (at least 5 characters)").max(1000);

/** A wall-clock time at the site ("2027-03-15T08:30"), read in the site's zone; the server stores the instant. */
export const localDateTimeSchema = singleLineText().regex(
  /^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])T([01]\d|2[0-3]):[0-5]\d$/,
  "Enter a date and time, e.g. 2027-03-15T08:30",
);

export const acceptWorkOrderSchema = z.object({ arrivalLocal: localDateTimeSchema });
export type AcceptWorkOrder = z.infer<typeof acceptWorkOrderSchema>;

export const declineWorkOrderSchema = z.object({
  reason: reasonSchema,
  /** A day the technician could come instead; the shop may take it with one click. */
  proposedDate: isoDateSchema.optional(),
});
export type DeclineWorkOrder = z.infer<typeof declineWorkOrderSchema>;

export const cancelWorkOrderSchema = z.object({ reason: reasonSchema });
export const disputeWorkOrderSchema = z.object({ reason: reasonSchema });

/** The same job again, for a technician the buyer picks (or the same one, on the date they proposed). */
export const sendAgainSchema = z.object({
  technicianId: idParam,
  preferredDates: z
    .array(isoDateSchema)
    .max(MAX_PREFERRED_DATES, `At most ${MAX_PREFERRED_DATES} dates`)
    .optional(),
});
export type SendAgain = z.infer<typeof sendAgainSchema>;

// Hours are recorded to the quarter hour or finer; 2 decimals is what the column keeps.
const hoursSchema = z.number().min(0).max(999).multipleOf(0.01);

export const completeWorkOrderSchema = z.object({
  hoursWorked: hoursSchema.refine((h) => h > 0, "Hours worked must be more than 0"),
  travelHours: hoursSchema,
  note: multiLineText().trim().max(5000).optional(),
  partsUsed: partsUsedSchema.default([]),
});
export type CompleteWorkOrder = z.infer<typeof completeWorkOrderSchema>;

export const listWorkOrdersQuerySchema = z.object({
  status: z.enum(workOrderStatuses).optional(),
});

/** The message text as a form field (multipart) or JSON; the file, when any, is the multipart part `file`. */
export const postMessageSchema = z.object({
  body: multiLineText().trim().min(1, "Write a message").max(5000),
});

export const standingProofQuerySchema = z.object({
  at: z.enum(["accepted", "completed"]).optional(),
});

// Response shapes: the server's DTO types are inferred from these and the client parses its answers with them.

const personRefSchema = z.object({ id: z.number(), name: z.string() });

export const workOrderSummaryDtoSchema = z.object({
  id: z.number(),
  status: z.enum(workOrderStatuses),
  urgency: z.enum(urgencies),
  technology: z.string(),
  problem: z.string(),
  shopName: z.string(),
  siteName: z.string(),
  technicianName: z.string(),
  serviceCompanyName: z.string(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type WorkOrderSummaryDto = z.infer<typeof workOrderSummaryDtoSchema>;

/** The machine as the work order names it; a machine removed from its site leaves only its id and technology. */
export const workOrderEquipmentDtoSchema = z.object({
  id: z.number(),
  builder: z.string(),
  controlFamily: z.string().nullable(),
  technology: z.string(),
  model: z.string().nullable(),
  serialNumber: z.string().nullable(),
});
export type WorkOrderEquipmentDto = z.infer<typeof workOrderEquipmentDtoSchema>;

export const onSiteDetailsDtoSchema = z.object({
  addressLine: z.string(),
  city: z.string().nullable(),
  state: z.string().nullable(),
  postalCode: z.string().nullable(),
  siteContactName: z.string().nullable(),
  siteContactPhone: z.string().nullable(),
  poNumber: z.string().nullable(),
  notToExceedCents: z.number().nullable(),
  safetyInductionNote: z.string().nullable(),
});
export type OnSiteDetailsDto = z.infer<typeof onSiteDetailsDtoSchema>;

export const workOrderDtoSchema = z.object({
  id: z.number(),
  status: z.enum(workOrderStatuses),
  /** Which side the caller is on, and what the caller may do next. */
  yourSide: z.enum(workOrderSides),
  actions: z.array(z.enum(workOrderActions)),
  urgency: z.enum(urgencies),
  technology: z.string(),
  problem: z.string(),
  preferredDates: z.array(z.string()),
  shop: z.object({ companyId: z.number(), name: z.string() }),
  site: z.object({
    id: z.number(),
    name: z.string(),
    postalCode: z.string().nullable(),
    timeZone: z.string().nullable(),
  }),
  equipment: workOrderEquipmentDtoSchema.nullable(),
  technician: z.object({ id: z.number(), name: z.string(), companyId: z.number(), companyName: z.string() }),
  requirementSet: z.object({ id: z.number(), name: z.string() }).nullable(),
  /** Left out for the service side until it has accepted the job. */
  onSite: onSiteDetailsDtoSchema.optional(),
  declineReason: z.string().nullable(),
  proposedDate: z.string().nullable(),
  arrivalAt: z.string().nullable(),
  cancelReason: z.string().nullable(),
  disputeReason: z.string().nullable(),
  /** The job this one was copied from, and (shop side only) the copies sent on after a decline. */
  copiedFromId: z.number().nullable(),
  copies: z.array(z.number()),
  canSendAgain: z.boolean(),
  hoursWorked: z.number().nullable(),
  travelHours: z.number().nullable(),
  completionNote: z.string().nullable(),
  /** For the machine's history: the kind of work, where the trouble was, and the parts fitted at completion. */
  kind: z.enum(workKinds).nullable(),
  problemArea: z.enum(problemAreas).nullable(),
  partsUsed: z.array(partUsedDtoSchema),
  snapshotAccepted: standingSnapshotSchema.nullable(),
  snapshotCompleted: standingSnapshotSchema.nullable(),
  createdBy: personRefSchema,
  createdAt: z.string(),
  acceptedAt: z.string().nullable(),
  declinedAt: z.string().nullable(),
  completedAt: z.string().nullable(),
  confirmedAt: z.string().nullable(),
  cancelledAt: z.string().nullable(),
  disputedAt: z.string().nullable(),
  updatedAt: z.string(),
});
export type WorkOrderDto = z.infer<typeof workOrderDtoSchema>;

export const workOrderMessageDtoSchema = z.object({
  id: z.number(),
  workOrderId: z.number(),
  author: personRefSchema,
  side: z.enum(workOrderSides),
  body: z.string(),
  attachment: z
    .object({
      documentId: z.number(),
      name: z.string(),
      mime: z.string(),
      sizeBytes: z.number(),
      url: z.string(),
      /** A small picture made at upload for an image attachment, with its pixel size so the page does not jump. */
      thumbnail: z.object({ url: z.string(), width: z.number(), height: z.number() }).nullable(),
    })
    .nullable(),
  createdAt: z.string(),
});
export type WorkOrderMessageDto = z.infer<typeof workOrderMessageDtoSchema>;

/** The 409 body's `fields` name each unmet requirement when a technician is not cleared. */
export interface NotClearedProblem {
  path: string;
  message: string;
}
