/**
 * E-mail deliveries of an issued revision's workbook (the outbox): the request, shared by the endpoint and the
 * outbox form, and the wire types of the answers.
 */
import { z } from "./zod";
import { email, optionalText, plainString, rowId } from "./common";
import { id, instant, nextCursor } from "./wire";

/** At most this many addresses a delivery (typed addresses and members together). */
export const MAX_DELIVERY_RECIPIENTS = 50;

export const DELIVERY_STATUSES = ["queued", "sending", "sent", "failed"] as const;
export type DeliveryStatus = (typeof DELIVERY_STATUSES)[number];

/** A revision letter as issued (A … Z, AA …). */
export const revisionLetterField = plainString("revision").pipe(
  z
    .string()
    .trim()
    .min(1, "revision is required (the letter of an issued revision, e.g. A)")
    .max(4, "revision must be a letter such as A or AB")
    .regex(/^[A-Z]+$/, "revision must be the letter of an issued revision, e.g. A"),
);

const recipientCount = (v: { to: string[]; memberIds: string[] }) => new Set(v.to).size + new Set(v.memberIds).size;

/** POST /projects/:id/deliveries: typed addresses and/or members of the project's organisation, and a message. */
export const DeliveryRequest = z
  .object({
    revision: revisionLetterField,
    to: z
      .array(email, { error: "to must be a list of e-mail addresses" })
      .max(MAX_DELIVERY_RECIPIENTS, `to may hold at most ${MAX_DELIVERY_RECIPIENTS} addresses`)
      .default([]),
    memberIds: z
      .array(rowId, { error: "memberIds must be a list of member ids" })
      .max(MAX_DELIVERY_RECIPIENTS, `memberIds may hold at most ${MAX_DELIVERY_RECIPIENTS} members`)
      .default([]),
    message: optionalText("message", 4000, { multiline: true }),
  })
  .strict()
  .superRefine((v, ctx) => {
    const n = recipientCount(v);
    if (n === 0) ctx.addIssue({ code: "custom", path: ["to"], message: "Name at least one recipient: an e-mail address or a member" });
    if (n > MAX_DELIVERY_RECIPIENTS)
      ctx.addIssue({
        code: "custom",
        path: ["to"],
        message: `A delivery goes to at most ${MAX_DELIVERY_RECIPIENTS} recipients; this one names ${n}`,
      });
  });
export type DeliveryRequest = z.input<typeof DeliveryRequest>;
/** The request as parsed (defaults applied, addresses lower-cased). */
export type DeliveryRequestBody = z.output<typeof DeliveryRequest>;

/** Splits typed text (commas, semicolons, spaces or line breaks) into addresses, for the outbox form. */
export const splitAddresses = (text: string): string[] =>
  text
    .split(/[\s,;]+/)
    .map((s) => s.trim())
    .filter(Boolean);

/** Who the outbox form offers as recipients: members of the project's organisation who receive exports. */
export interface DeliveryMemberChoice {
  memberId: string;
  name: string;
  email: string;
  role: string;
}

// ---- responses ------------------------------------------------------------------------------------------------

export const DeliveryRecipient = z.object({ email: z.string(), name: z.string().optional(), memberId: z.string().optional() });
export type DeliveryRecipient = z.output<typeof DeliveryRecipient>;

export const DeliveryResponse = z.object({
  id,
  projectId: id,
  revision: z.string(),
  recipients: z.array(DeliveryRecipient),
  message: z.string().nullable(),
  status: z.enum(DELIVERY_STATUSES),
  attempts: z.number().int().describe("Sending attempts so far (0 while the first waits in the queue)"),
  lastError: z.string().nullable().describe("The SMTP server's (or the workbook's) error of the last failed attempt"),
  createdAt: instant,
  createdBy: z.string(),
  sentAt: instant.nullable(),
  messageId: z.string().nullable(),
  attachment: z
    .object({ fileName: z.string(), sha256: z.string(), sizeBytes: z.number().int() })
    .nullable()
    .describe("The workbook attached, once built (the same bytes on every attempt)"),
});
export type DeliveryResponse = z.output<typeof DeliveryResponse>;

export const DeliveryStatusResponse = z.object({ delivery: DeliveryResponse });
export const DeliveryCreatedResponse = z.object({ id, status: z.enum(DELIVERY_STATUSES), delivery: DeliveryResponse });
export const DeliveryPageResponse = z.object({ deliveries: z.array(DeliveryResponse).describe("Newest first"), nextCursor });
