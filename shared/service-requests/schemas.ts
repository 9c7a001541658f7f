import { multiLineText, singleLineText } from "../api/text.ts";
import { z } from "zod";
import { idParam } from "../credentials/schemas.ts";
import { isoDateSchema } from "../credentials/credential-fields.ts";
import { machineTechnologies } from "../technicians/schemas.ts";
import { requirementStatuses, standings } from "../standing/standing-types.ts";
import { companyActionNames, requestActions } from "./request-transitions.ts";

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

// Response shapes: the server's DTO types are inferred from these and the client parses its answers with them.

const invitationSources = ["routing", "buyer"] as const;
const threadSides = ["shop", "service"] as const;
const answers = ["estimate", "pass"] as const;

export const routedCompanyDtoSchema = z.object({
  companyId: z.number(),
  companyName: z.string(),
  clearedTechnicians: z.number(),
  oemTrained: z.boolean(),
  nearestMiles: z.number().nullable(),
  source: z.enum(invitationSources),
});
export type RoutedCompanyDto = z.infer<typeof routedCompanyDtoSchema>;

export const routingPreviewDtoSchema = z.object({
  count: z.number(),
  companies: z.array(routedCompanyDtoSchema),
  /** Roster companies the buyer asked for that cannot be invited, with the reason. */
  refused: z.array(z.object({ companyId: z.number(), reason: z.string() })),
});
export type RoutingPreviewDto = z.infer<typeof routingPreviewDtoSchema>;

export const estimateTotalDtoSchema = z.object({
  travelCents: z.number(),
  labourCents: z.number(),
  mileageCents: z.number(),
  partsCents: z.number(),
  totalCents: z.number(),
  /** Parts listed without a price: the total leaves them out. */
  unpricedParts: z.number(),
  basis: z.literal("before tax"),
});
export type EstimateTotalDto = z.infer<typeof estimateTotalDtoSchema>;

/** A part as the stored estimate carries it (the input's defaults already applied). */
const estimatePartDtoSchema = z.object({
  description: z.string(),
  quantity: z.number(),
  unitPriceCents: z.number().nullable(),
});

export const estimateRevisionDtoSchema = z.object({
  revision: z.number(),
  technicianId: z.number(),
  technicianName: z.string(),
  hourlyRateCents: z.number(),
  travelRateCents: z.number(),
  mileageRateCents: z.number(),
  onSiteHours: z.number(),
  earliestArrival: z.string(),
  parts: z.array(estimatePartDtoSchema),
  note: z.string().nullable(),
  validUntil: z.string(),
  distanceMiles: z.number(),
  driveHours: z.number(),
  total: estimateTotalDtoSchema,
  createdAt: z.string(),
});
export type EstimateRevisionDto = z.infer<typeof estimateRevisionDtoSchema>;

export const estimateDtoSchema = z.object({
  id: z.number(),
  requestId: z.number(),
  companyId: z.number(),
  companyName: z.string(),
  status: z.enum(estimateStatuses),
  current: estimateRevisionDtoSchema,
  revisions: z.array(estimateRevisionDtoSchema),
});
export type EstimateDto = z.infer<typeof estimateDtoSchema>;

/** A file the shop attached to its request (the POST answers its id and link only). */
export const attachmentAddedDtoSchema = z.object({ id: z.number(), url: z.string() });

export const attachmentDtoSchema = attachmentAddedDtoSchema.extend({
  name: z.string(),
  mime: z.string(),
  sizeBytes: z.number(),
});
export type AttachmentDto = z.infer<typeof attachmentDtoSchema>;

export const requestMessageDtoSchema = z.object({
  id: z.number(),
  side: z.enum(threadSides),
  author: z.string(),
  body: z.string(),
  attachment: attachmentDtoSchema.omit({ id: true }).nullable(),
  createdAt: z.string(),
});
export type RequestMessageDto = z.infer<typeof requestMessageDtoSchema>;

export const invitationDtoSchema = z.object({
  companyId: z.number(),
  companyName: z.string(),
  source: z.enum(invitationSources),
  invitedAt: z.string(),
  firstAnswerAt: z.string().nullable(),
  answer: z.enum(answers).nullable(),
  passReason: z.string().nullable(),
});
export type InvitationDto = z.infer<typeof invitationDtoSchema>;

export const timelineEventDtoSchema = z.object({
  id: z.number(),
  kind: z.string(),
  actor: z.string().nullable(),
  thresholdHours: z.number().nullable(),
  note: z.string().nullable(),
  createdAt: z.string(),
});
export type TimelineEventDto = z.infer<typeof timelineEventDtoSchema>;

export const serviceRequestDtoSchema = z.object({
  id: z.number(),
  status: z.enum(requestStatuses),
  kind: z.enum(requestKinds),
  machineState: z.enum(machineStates),
  timing: z.enum(["soonest", "window"]),
  windowStart: z.string().nullable(),
  windowEnd: z.string().nullable(),
  technology: z.string(),
  builder: z.string().nullable(),
  controlFamily: z.string().nullable(),
  problem: z.string(),
  requirementSet: z.object({ id: z.number().nullable(), name: z.string() }),
  machine: z
    .object({ id: z.number(), builder: z.string(), controlFamily: z.string(), model: z.string() })
    .nullable(),
  /** The street appears only for the shop, and for the chosen company once accepted. */
  site: z.object({
    id: z.number(),
    name: z.string().nullable(),
    city: z.string(),
    state: z.string(),
    postalCode: z.string(),
    street: z.string().nullable(),
    timeZone: z.string(),
  }),
  sentAt: z.string(),
  decidedAt: z.string().nullable(),
  cancelReason: z.string().nullable(),
  workOrderId: z.number().nullable(),
  attachments: z.array(attachmentDtoSchema),
  /** What the caller may do now, decided by the server (a coordinator may only log a follow-up). */
  actions: z.array(z.enum([...requestActions, ...companyActionNames, "log_follow_up"])),
  /** Shop: everyone invited. Company: its own invitation only. */
  invitations: z.array(invitationDtoSchema),
  /** Shop: every estimate. Company: its own. */
  estimates: z.array(estimateDtoSchema),
  timeline: z.array(timelineEventDtoSchema),
});
export type ServiceRequestDto = z.infer<typeof serviceRequestDtoSchema>;

export const serviceRequestSummaryDtoSchema = z.object({
  id: z.number(),
  status: z.enum(requestStatuses),
  kind: z.enum(requestKinds),
  machineState: z.enum(machineStates),
  problem: z.string(),
  siteArea: z.string(),
  sentAt: z.string(),
  invited: z.number(),
  estimates: z.number(),
  /** Company side: its own answer. */
  answer: z.enum(answers).nullable(),
});
export type ServiceRequestSummaryDto = z.infer<typeof serviceRequestSummaryDtoSchema>;

export const comparisonRequirementDtoSchema = z.object({
  label: z.string(),
  status: z.enum(requirementStatuses),
  detail: z.string(),
});
export type ComparisonRequirementDto = z.infer<typeof comparisonRequirementDtoSchema>;

export const comparisonRowDtoSchema = z.object({
  estimateId: z.number(),
  companyId: z.number(),
  companyName: z.string(),
  technicianId: z.number(),
  technicianName: z.string(),
  standing: z.enum(standings),
  requirements: z.array(comparisonRequirementDtoSchema),
  distanceMiles: z.number(),
  driveHours: z.number(),
  earliestArrival: z.string(),
  total: estimateTotalDtoSchema,
  revision: z.number(),
  rating: z.object({ count: z.number(), average: z.number().nullable(), score: z.number() }),
  medianResponseMinutes: z.number().nullable(),
  acceptedEstimates: z.number(),
  validUntil: z.string(),
});
export type ComparisonRowDto = z.infer<typeof comparisonRowDtoSchema>;

export const comparisonDtoSchema = z.object({
  requestId: z.number(),
  timeZone: z.string(),
  rows: z.array(comparisonRowDtoSchema),
});
export type ComparisonDto = z.infer<typeof comparisonDtoSchema>;

export const followUpRowDtoSchema = z.object({
  requestId: z.number(),
  shopName: z.string(),
  machineState: z.enum(machineStates),
  siteArea: z.string(),
  sentAt: z.string(),
  invited: z.number(),
  answered: z.number(),
  remindersSent: z.number(),
  lastAction: z.string().nullable(),
});
export type FollowUpRowDto = z.infer<typeof followUpRowDtoSchema>;

/** The answer to a coordinator's note: which request's timeline it joined. */
export const followUpLoggedDtoSchema = z.object({ requestId: z.number(), logged: z.literal(true) });
