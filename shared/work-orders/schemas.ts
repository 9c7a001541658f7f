import { z } from "zod";
import { singleLineText, multiLineText } from "../api/text.ts";
import { idParam } from "../credentials/schemas.ts";
import { isoDateSchema } from "../credentials/credential-fields.ts";
import type { StandingSnapshot } from "./standing-snapshot.ts";
import {
  partsUsedSchema,
  problemAreas,
  workKinds,
  type PartUsed,
  type ProblemArea,
  type WorkKind,
} from "../machines/service-history.ts";

export const workOrderStatuses = ["requested", "accepted", "declined", "completed", "confirmed"] as const;
export type WorkOrderStatus = (typeof workOrderStatuses)[number];

// "down" = the machine is down: production has stopped, the most urgent call-out.
export const urgencies = ["low", "normal", "high", "down"] as const;
export type Urgency = (typeof urgencies)[number];

export const workOrderSides = ["shop", "service"] as const;
export type WorkOrderSide = (typeof workOrderSides)[number];

export const workOrderActions = ["accept", "decline", "complete", "confirm"] as const;
export type WorkOrderAction = (typeof workOrderActions)[number];

export const workOrderParamsSchema = z.object({ workOrderId: idParam });
export const messageFileParamsSchema = z.object({ workOrderId: idParam, messageId: idParam });

export const MAX_PREFERRED_DATES = 5;

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
});
export type RaiseWorkOrder = z.infer<typeof raiseWorkOrderSchema>;

export const declineWorkOrderSchema = z.object({
  reason: multiLineText().trim().min(5, "Say why (at least 5 characters)").max(1000),
});

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

export interface WorkOrderSummaryDto {
  id: number;
  status: WorkOrderStatus;
  urgency: Urgency;
  technology: string;
  problem: string;
  shopName: string;
  siteName: string;
  technicianName: string;
  serviceCompanyName: string;
  createdAt: string;
  updatedAt: string;
}

export interface WorkOrderEquipmentDto {
  id: number;
  builder: string;
  controlFamily: string | null;
  technology: string;
  model: string | null;
  serialNumber: string | null;
}

export interface WorkOrderDto {
  id: number;
  status: WorkOrderStatus;
  /** Which side the caller is on, and what the caller may do next. */
  yourSide: WorkOrderSide;
  actions: WorkOrderAction[];
  urgency: Urgency;
  technology: string;
  problem: string;
  preferredDates: string[];
  shop: { companyId: number; name: string };
  site: { id: number; name: string; postalCode: string | null; timeZone: string | null };
  equipment: WorkOrderEquipmentDto | null;
  technician: { id: number; name: string; companyId: number; companyName: string };
  requirementSet: { id: number; name: string } | null;
  declineReason: string | null;
  hoursWorked: number | null;
  travelHours: number | null;
  completionNote: string | null;
  /** For the machine's history: the kind of work, where the trouble was, and the parts fitted at completion. */
  kind: WorkKind | null;
  problemArea: ProblemArea | null;
  partsUsed: PartUsed[];
  snapshotAccepted: StandingSnapshot | null;
  snapshotCompleted: StandingSnapshot | null;
  createdBy: { id: number; name: string };
  createdAt: string;
  acceptedAt: string | null;
  declinedAt: string | null;
  completedAt: string | null;
  confirmedAt: string | null;
  updatedAt: string;
}

export interface WorkOrderMessageDto {
  id: number;
  workOrderId: number;
  author: { id: number; name: string };
  side: WorkOrderSide;
  body: string;
  attachment: {
    documentId: number;
    name: string;
    mime: string;
    sizeBytes: number;
    url: string;
    /** A small picture made at upload for an image attachment, with its pixel size so the page does not jump. */
    thumbnail: { url: string; width: number; height: number } | null;
  } | null;
  createdAt: string;
}

/** The 409 body's `fields` name each unmet requirement when a technician is not cleared. */
export interface NotClearedProblem {
  path: string;
  message: string;
}
