import { problemAreas, workKinds } from "@shared/machines/service-history.ts";
import { z } from "zod";
import { requirementStatuses, standings, unmetReasons } from "@shared/standing/standing-types.ts";
import {
  urgencies,
  workOrderActions,
  workOrderSides,
  workOrderStatuses,
} from "@shared/work-orders/schemas.ts";

// Run-time checks of shared/work-orders/schemas.ts and standing-snapshot.ts.
export const workOrderSummarySchema = z.object({
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
export type WorkOrderSummary = z.infer<typeof workOrderSummarySchema>;

const snapshotSchema = z.object({
  takenAt: z.string(),
  technicianName: z.string(),
  companyName: z.string(),
  standing: z.enum(standings),
  targets: z.array(
    z.object({
      requirementSetId: z.number().nullable(),
      name: z.string(),
      standing: z.enum(standings),
      earliestLapse: z.string().nullable(),
      requirements: z.array(
        z.object({
          label: z.string(),
          status: z.enum(requirementStatuses),
          reason: z.enum(unmetReasons).nullable(),
          detail: z.string(),
          // Snapshots taken before stacked limits were described carry no metBy.
          metBy: z.string().nullable().optional(),
          credential: z
            .object({
              id: z.number(),
              typeName: z.string(),
              reference: z.string().nullable(),
              lapsesAt: z.string().nullable(),
            })
            .nullable(),
        }),
      ),
    }),
  ),
});
export type StandingSnapshot = z.infer<typeof snapshotSchema>;

export const workOrderSchema = z.object({
  id: z.number(),
  status: z.enum(workOrderStatuses),
  yourSide: z.enum(workOrderSides),
  actions: z.array(z.enum(workOrderActions)),
  urgency: z.enum(urgencies),
  technology: z.string(),
  problem: z.string(),
  preferredDates: z.array(z.string()),
  shop: z.object({ companyId: z.number(), name: z.string() }),
  site: z.object({ id: z.number(), name: z.string() }).loose(),
  equipment: z
    .object({
      id: z.number(),
      builder: z.string(),
      controlFamily: z.string().nullable(),
      technology: z.string(),
      model: z.string().nullable(),
      serialNumber: z.string().nullable(),
    })
    .nullable(),
  technician: z.object({ id: z.number(), name: z.string(), companyId: z.number(), companyName: z.string() }),
  requirementSet: z.object({ id: z.number(), name: z.string() }).nullable(),
  // Absent for the service side until it has accepted the job.
  onSite: z
    .object({
      addressLine: z.string(),
      city: z.string().nullable(),
      state: z.string().nullable(),
      postalCode: z.string().nullable(),
      siteContactName: z.string().nullable(),
      siteContactPhone: z.string().nullable(),
      poNumber: z.string().nullable(),
      notToExceedCents: z.number().nullable(),
      safetyInductionNote: z.string().nullable(),
    })
    .optional(),
  declineReason: z.string().nullable(),
  proposedDate: z.string().nullable(),
  arrivalAt: z.string().nullable(),
  cancelReason: z.string().nullable(),
  disputeReason: z.string().nullable(),
  copiedFromId: z.number().nullable(),
  copies: z.array(z.number()),
  canSendAgain: z.boolean(),
  hoursWorked: z.number().nullable(),
  travelHours: z.number().nullable(),
  completionNote: z.string().nullable(),
  kind: z.enum(workKinds).nullable().optional(),
  problemArea: z.enum(problemAreas).nullable().optional(),
  partsUsed: z
    .array(
      z.object({
        description: z.string(),
        partNumber: z.string().nullable().optional(),
        quantity: z.number(),
      }),
    )
    .optional(),
  snapshotAccepted: snapshotSchema.nullable(),
  snapshotCompleted: snapshotSchema.nullable(),
  createdBy: z.object({ id: z.number(), name: z.string() }),
  createdAt: z.string(),
  acceptedAt: z.string().nullable(),
  declinedAt: z.string().nullable(),
  completedAt: z.string().nullable(),
  confirmedAt: z.string().nullable(),
  cancelledAt: z.string().nullable(),
  disputedAt: z.string().nullable(),
});
export type WorkOrder = z.infer<typeof workOrderSchema>;

export const workOrderMessageSchema = z.object({
  id: z.number(),
  author: z.object({ id: z.number(), name: z.string() }),
  side: z.enum(workOrderSides),
  body: z.string(),
  attachment: z
    .object({
      documentId: z.number(),
      name: z.string(),
      mime: z.string(),
      sizeBytes: z.number(),
      url: z.string(),
      thumbnail: z
        .object({ url: z.string(), width: z.number(), height: z.number() })
        .nullable()
        .default(null),
    })
    .nullable(),
  createdAt: z.string(),
});
export type WorkOrderMessage = z.infer<typeof workOrderMessageSchema>;
