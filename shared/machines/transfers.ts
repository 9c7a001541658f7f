import { z } from "zod";
import { multiLineText, singleLineText } from "../api/text.ts";
import { emailSchema } from "../accounts/schemas.ts";
import { idParam } from "../credentials/schemas.ts";
import { equipmentDtoSchema } from "../sites/schemas.ts";

/** A transfer waits for the receiving shop, then ends one way: taken over, turned down, or called back by the seller. */
export const transferStates = ["open", "accepted", "declined", "withdrawn"] as const;
export type TransferState = (typeof transferStates)[number];

export type TransferSide = "seller" | "receiver";
export type TransferAction = "accept" | "decline" | "withdraw";

/** The lifecycle as one table: the server enforces it and sends each caller the actions it may take. */
export const transferTransitions: Record<
  TransferAction,
  { from: TransferState; to: TransferState; by: TransferSide }
> = {
  accept: { from: "open", to: "accepted", by: "receiver" },
  decline: { from: "open", to: "declined", by: "receiver" },
  withdraw: { from: "open", to: "withdrawn", by: "seller" },
};

export function allowedTransferActions(state: TransferState, side: TransferSide): TransferAction[] {
  return (Object.keys(transferTransitions) as TransferAction[]).filter(
    (a) => transferTransitions[a].from === state && transferTransitions[a].by === side,
  );
}

export const transferStateLabels: Record<TransferState, string> = {
  open: "Waiting for the receiving shop",
  accepted: "Taken over",
  declined: "Declined",
  withdrawn: "Withdrawn",
};

export const transferParamsSchema = z.object({ transferId: idParam });

/** The buying shop is named by the e-mail one of its buyers signs in with. */
export const startTransferSchema = z.object({
  email: emailSchema,
  note: multiLineText().trim().max(1000).optional(),
});
export type StartTransfer = z.infer<typeof startTransferSchema>;

/** The receiving shop picks one of its own sites and, if it knows them, where in it the machine will stand. */
export const acceptTransferSchema = z.object({
  siteId: z.number().int().positive().max(2_147_483_647),
  building: singleLineText().trim().max(80).nullable().optional(),
  bay: singleLineText().trim().max(40).nullable().optional(),
});
export type AcceptTransfer = z.infer<typeof acceptTransferSchema>;

export const declineTransferSchema = z.object({
  reason: multiLineText().trim().max(1000).optional(),
});

/** The machine as it was named when the transfer started: what both shops agree is changing hands. */
export const transferMachineSchema = equipmentDtoSchema.pick({
  builder: true,
  controlFamily: true,
  technology: true,
  model: true,
  serialNumber: true,
  yearBuilt: true,
  inServiceOn: true,
});

/** What the seller had on its own record when the machine left (its read-only copy); never shown to the receiver. */
export const sellerRecordSchema = z.object({
  siteName: z.string(),
  building: z.string().nullable(),
  bay: z.string().nullable(),
  notes: z.string().nullable(),
  state: z.string(),
});

export const machineTransferSchema = z.object({
  id: z.number(),
  machineId: z.number(),
  state: z.enum(transferStates),
  side: z.enum(["seller", "receiver"]),
  machine: transferMachineSchema,
  fromShopName: z.string(),
  toShopName: z.string(),
  /** The address the seller named: shown to the seller only. */
  toEmail: z.string().nullable(),
  note: z.string().nullable(),
  declineReason: z.string().nullable(),
  startedAt: z.string(),
  decidedAt: z.string().nullable(),
  /** The receiver's site the machine went to: shown to the receiver only. */
  toSiteName: z.string().nullable(),
  sellerRecord: sellerRecordSchema.nullable(),
  actions: z.array(z.enum(["accept", "decline", "withdraw"])),
});
export type MachineTransferDto = z.infer<typeof machineTransferSchema>;

export const machineTransferListSchema = z.object({
  incoming: z.array(machineTransferSchema),
  outgoing: z.array(machineTransferSchema),
});
export type MachineTransferList = z.infer<typeof machineTransferListSchema>;

export const ownershipViewSchema = z.object({
  current: z.boolean(),
  periods: z.array(z.object({ from: z.string(), to: z.string().nullable(), yours: z.boolean() })),
});
export type OwnershipView = z.infer<typeof ownershipViewSchema>;

/** Each state's mark on screen: the shapes of the shared status table, worded for a transfer. */
export const transferStatusMarks = {
  open: { status: "requested", word: "Waiting" },
  accepted: { status: "accepted", word: "Taken over" },
  declined: { status: "declined", word: "Declined" },
  withdrawn: { status: "withdrawn", word: "Withdrawn" },
} as const satisfies Record<TransferState, { status: string; word: string }>;
