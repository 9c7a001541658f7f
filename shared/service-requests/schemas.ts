import { multiLineText, singleLineText } from "../api/text.ts";
import { z } from "zod";
import { idParam } from "../credentials/schemas.ts";
import { isoDateSchema } from "../credentials/credential-fields.ts";
import { machineTechnologies } from "../technicians/schemas.ts";
import type { StandingSnapshot } from "../work-orders/standing-snapshot.ts";

export const requestKinds = ["repair", "preventive_maintenance", "installation", "parts_only"] as const;
export type RequestKind = (typeof requestKinds)[number];
export const requestKindLabels: Record<RequestKind, string> = {
  repair: "Repair",
  preventive_maintenance: "Preventive maintenance",
  installation: "Installation and leveling",
  parts_only: "Parts only",
};

export const machineStates = ["down", "running_fault", "planned"] as const;
export type MachineState = (typeof machineStates)[number];
export const machineStateLabels: Record<MachineState, string> = {
  down: "Machine down",
  running_fault: "Running with a fault",
  planned: "Planned work",
};

export const requestStatuses = ["open", "decided", "cancelled", "expired"] as const;
export type RequestStatus = (typeof requestStatuses)[number];

export const estimateStatuses = ["active", "withdrawn", "accepted", "not_chosen"] as const;
export type EstimateStatus = (typeof estimateStatuses)[number];

export const serviceRequestParamsSchema = z.object({ requestId: idParam });
export const estimateParamsSchema = z.object({ requestId: idParam, estimateId: idParam });
export const threadParamsSchema = z.object({ requestId: idParam, companyId: idParam });
export const attachmentParamsSchema = z.object({ requestId: idParam, attachmentId: idParam });
export const threadFileParamsSchema = z.object({
  requestId: idParam,
  companyId: idParam,
  messageId: idParam,
});

// A dense metro area can hold hundreds of cleared companies; the buyer may untick any of them.
const MAX_COMPANY_CHANGES = 1000;

/** What a buyer describes; the shop and the author come from the session. */
export const serviceRequestBaseSchema = z.object({
  siteId: idParam,
  equipmentId: idParam.optional(),
  /** Null or absent = the platform baseline. */
  requirementSetId: idParam.nullable().optional(),
  // Taken from the machine when one is chosen and this is left out.
  technology: z.enum(machineTechnologies).optional(),
  kind: z.enum(requestKinds),
  machineState: z.enum(machineStates),
  timing: z.enum(["soonest", "window"]).default("soonest"),
  windowStart: isoDateSchema.optional(),
  windowEnd: isoDateSchema.optional(),
  // A machine that will not start is described in three words; the thread carries the rest.
  problem: multiLineText().trim().min(3, "Describe the problem (at least 3 characters)").max(5000),
  addCompanyIds: z.array(idParam).max(MAX_COMPANY_CHANGES).default([]),
  removeCompanyIds: z.array(idParam).max(MAX_COMPANY_CHANGES).default([]),
});

function checkWindow(
  value: { timing: "soonest" | "window"; windowStart?: string | undefined; windowEnd?: string | undefined },
  ctx: z.RefinementCtx,
) {
  if (value.timing !== "window") return;
  if (!value.windowStart)
    ctx.addIssue({ code: "custom", path: ["windowStart"], message: "required for a window" });
  if (!value.windowEnd)
    ctx.addIssue({ code: "custom", path: ["windowEnd"], message: "required for a window" });
  if (value.windowStart && value.windowEnd && value.windowEnd < value.windowStart)
    ctx.addIssue({ code: "custom", path: ["windowEnd"], message: "must not be before the start" });
}

export const raiseServiceRequestSchema = serviceRequestBaseSchema.superRefine(checkWindow);
export type RaiseServiceRequest = z.infer<typeof raiseServiceRequestSchema>;

const cents = z.number().int().min(0).max(100_000_000);

export const estimatePartSchema = z.object({
  description: singleLineText().trim().min(1).max(300),
  quantity: z.number().int().min(1).max(1000).default(1),
  /** Null = price not known yet; the part is listed but not in the total. */
  unitPriceCents: cents.nullable().default(null),
});
export type EstimatePart = z.infer<typeof estimatePartSchema>;

// A local wall-clock time at the site ("2026-12-04T09:30"): the site's zone is applied on the server.
const localDateTime = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/, "a date and time such as 2026-12-04T09:30");

export const estimateInputSchema = z.object({
  technicianId: idParam,
  hourlyRateCents: cents.refine((v) => v > 0, "must be more than 0"),
  travelRateCents: cents,
  mileageRateCents: cents,
  onSiteHours: z.number().min(0.25).max(500).multipleOf(0.25),
  earliestArrival: localDateTime,
  parts: z.array(estimatePartSchema).max(50).default([]),
  note: multiLineText().trim().max(5000).optional(),
  validUntil: isoDateSchema,
});
export type EstimateInput = z.infer<typeof estimateInputSchema>;

export const passSchema = z.object({
  reason: multiLineText().trim().min(3, "Say why (at least 3 characters)").max(1000),
});
export const cancelRequestSchema = z.object({
  reason: multiLineText().trim().min(3, "Say why (at least 3 characters)").max(1000),
});
export const followUpNoteSchema = z.object({
  note: multiLineText().trim().min(3, "Say what you did (at least 3 characters)").max(2000),
});
export const requestMessageSchema = z.object({ body: multiLineText().trim().min(1).max(5000) });

export interface RoutedCompanyDto {
  companyId: number;
  companyName: string;
  clearedTechnicians: number;
  oemTrained: boolean;
  nearestMiles: number | null;
  source: "routing" | "buyer";
}

export interface RoutingPreviewDto {
  count: number;
  companies: RoutedCompanyDto[];
  /** Roster companies the buyer asked for that cannot be invited, with the reason. */
  refused: { companyId: number; reason: string }[];
}

export interface EstimateTotalDto {
  travelCents: number;
  labourCents: number;
  mileageCents: number;
  partsCents: number;
  totalCents: number;
  /** Parts listed without a price: the total leaves them out. */
  unpricedParts: number;
  basis: "before tax";
}

export interface EstimateRevisionDto {
  revision: number;
  technicianId: number;
  technicianName: string;
  hourlyRateCents: number;
  travelRateCents: number;
  mileageRateCents: number;
  onSiteHours: number;
  earliestArrival: string;
  parts: EstimatePart[];
  note: string | null;
  validUntil: string;
  distanceMiles: number;
  driveHours: number;
  total: EstimateTotalDto;
  createdAt: string;
}

export interface EstimateDto {
  id: number;
  requestId: number;
  companyId: number;
  companyName: string;
  status: EstimateStatus;
  current: EstimateRevisionDto;
  revisions: EstimateRevisionDto[];
}

export interface AttachmentDto {
  id: number;
  name: string;
  mime: string;
  sizeBytes: number;
  url: string;
}

export interface RequestMessageDto {
  id: number;
  side: "shop" | "service";
  author: string;
  body: string;
  attachment: { name: string; mime: string; sizeBytes: number; url: string } | null;
  createdAt: string;
}

export interface InvitationDto {
  companyId: number;
  companyName: string;
  source: "routing" | "buyer";
  invitedAt: string;
  firstAnswerAt: string | null;
  answer: "estimate" | "pass" | null;
  passReason: string | null;
}

export interface TimelineEventDto {
  id: number;
  kind: string;
  actor: string | null;
  thresholdHours: number | null;
  note: string | null;
  createdAt: string;
}

export interface ServiceRequestDto {
  id: number;
  status: RequestStatus;
  kind: RequestKind;
  machineState: MachineState;
  timing: "soonest" | "window";
  windowStart: string | null;
  windowEnd: string | null;
  technology: string;
  builder: string | null;
  controlFamily: string | null;
  problem: string;
  requirementSet: { id: number | null; name: string };
  machine: { id: number; builder: string; controlFamily: string; model: string } | null;
  /** The street appears only for the shop, and for the chosen company once accepted. */
  site: {
    id: number;
    name: string | null;
    city: string;
    state: string;
    postalCode: string;
    street: string | null;
    timeZone: string;
  };
  sentAt: string;
  decidedAt: string | null;
  cancelReason: string | null;
  workOrderId: number | null;
  attachments: AttachmentDto[];
  /** What the caller may do now, decided by the server. */
  actions: string[];
  /** Shop: everyone invited. Company: its own invitation only. */
  invitations: InvitationDto[];
  /** Shop: every estimate. Company: its own. */
  estimates: EstimateDto[];
  timeline: TimelineEventDto[];
}

export interface ServiceRequestSummaryDto {
  id: number;
  status: RequestStatus;
  kind: RequestKind;
  machineState: MachineState;
  problem: string;
  siteArea: string;
  sentAt: string;
  invited: number;
  estimates: number;
  /** Company side: its own answer. */
  answer: "estimate" | "pass" | null;
}

export interface ComparisonRequirementDto {
  label: string;
  status: string;
  detail: string;
}

export interface ComparisonRowDto {
  estimateId: number;
  companyId: number;
  companyName: string;
  technicianId: number;
  technicianName: string;
  standing: StandingSnapshot["standing"];
  requirements: ComparisonRequirementDto[];
  distanceMiles: number;
  driveHours: number;
  earliestArrival: string;
  total: EstimateTotalDto;
  revision: number;
  rating: { count: number; average: number | null; score: number };
  medianResponseMinutes: number | null;
  acceptedEstimates: number;
  validUntil: string;
}

export interface ComparisonDto {
  requestId: number;
  timeZone: string;
  rows: ComparisonRowDto[];
}

export interface FollowUpRowDto {
  requestId: number;
  shopName: string;
  machineState: MachineState;
  siteArea: string;
  sentAt: string;
  invited: number;
  answered: number;
  remindersSent: number;
  lastAction: string | null;
}
