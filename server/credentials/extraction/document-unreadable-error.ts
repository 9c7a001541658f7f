export type UnreadableReason = "empty" | "corrupt" | "timeout" | "encrypted";

const MESSAGES: Record<UnreadableReason, string> = {
  empty: "The file is empty",
  corrupt: "The file is damaged or is not a readable PDF",
  timeout: "Reading the file took too long",
  encrypted: "The PDF is protected by a password",
};

/** A document we cannot read, with the reason the uploader is told (the route answers 422). */
export class DocumentUnreadableError extends Error {
  override readonly name = "DocumentUnreadableError";
  constructor(
    readonly reason: UnreadableReason,
    detail?: string,
  ) {
    super(detail ? `${MESSAGES[reason]}: ${detail}` : MESSAGES[reason]);
  }
}
