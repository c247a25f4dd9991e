/**
 * E-mail deliveries of an issued revision's workbook to the design team (the outbox).
 *
 * A request validates the recipients and the revision, counts against the organisation's hourly limit, and then
 * writes the delivery row and its queue job in ONE transaction: either both exist or neither, so a delivery is
 * never queued without a job nor sent without a row to show it. The job (`attemptDelivery`, run by the worker in
 * `lib/server/jobs/worker.ts`) builds the workbook once, keeps its bytes and SHA-256 on the row before the first
 * send (so every retry attaches the same file and the outbox can offer it), sends it, and records each attempt:
 * sending → sent with the Message-ID, or the error and back to queued for the queue's next retry, or failed after
 * the last one. A failure stays on the row; nothing is dropped.
 */
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import { drizzle } from "drizzle-orm/node-postgres";
import { db, pool } from "@/lib/server/db/client";
import * as schema from "@/lib/server/db/schema";
import { delivery, member, projectShare, scheduleRevision, user } from "@/lib/server/db/schema";
import { InvalidError, RateLimitedError } from "@/lib/server/errors";
import { roleCan } from "@/lib/auth/roles";
import { serverEnv } from "@/lib/server/env";
import { hit, type LimitRule } from "@/lib/server/rate-limit";
import { canSendMail, sendMail } from "@/lib/server/mail";
import { DELIVERY_QUEUE, deliveryRetry, queue, sqlOn } from "@/lib/server/jobs/queue";
import type { DeliveryMemberChoice, DeliveryRecipient, DeliveryResponse, DeliveryStatus } from "@/lib/contracts/deliveries";
import type { DeliveryRequestBody } from "@/lib/contracts/deliveries";
import { pageOf, type Page, type PageQuery } from "@/lib/contracts/pagination";
import { instantKey, newestFirst, olderThanCursor } from "@/lib/server/db/newest-first";
import { recordEvent, type Actor } from "./history";
import type { ProjectRow } from "./access";
import { workbookFile } from "./workbook";

export type DeliveryRow = typeof delivery.$inferSelect;

export const XLSX_TYPE = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";

/** Deliveries an organisation may start per hour (DELIVERY_RATE_LIMIT). */
export const deliveryLimit = (): LimitRule => ({ name: "delivery:org", max: serverEnv().DELIVERY_RATE_LIMIT, windowSeconds: 60 * 60 });

export function deliveryResponse(r: DeliveryRow): DeliveryResponse {
  return {
    id: r.id,
    projectId: r.projectId,
    revision: r.revisionLetter,
    recipients: r.recipients as DeliveryRecipient[],
    message: r.message,
    status: r.status as DeliveryStatus,
    attempts: r.attempts,
    lastError: r.lastError,
    createdAt: r.createdAt.toISOString(),
    createdBy: r.createdByName,
    sentAt: r.sentAt?.toISOString() ?? null,
    messageId: r.messageId,
    attachment:
      r.attachmentName && r.attachmentSha256 && r.attachment
        ? { fileName: r.attachmentName, sha256: r.attachmentSha256, sizeBytes: r.attachment.length }
        : null,
  };
}

/**
 * Members of the project's organisation who may receive its workbook: every role that receives exports, and of
 * those who see only shared projects (clients), only the ones this project is shared with. Sorted by name.
 */
export async function deliveryMemberChoices(p: ProjectRow): Promise<DeliveryMemberChoice[]> {
  const rows = await db
    .select({
      memberId: member.id,
      role: member.role,
      name: user.name,
      email: user.email,
      shared: sql<boolean>`${projectShare.memberId} is not null`,
    })
    .from(member)
    .innerJoin(user, eq(user.id, member.userId))
    .leftJoin(projectShare, and(eq(projectShare.memberId, member.id), eq(projectShare.projectId, p.id)))
    .where(eq(member.organizationId, p.organizationId))
    .orderBy(asc(user.name), asc(member.id));
  return rows
    .filter((r) => roleCan(r.role, { export: ["receive"] }) && (roleCan(r.role, { project: ["readAll"] }) || r.shared))
    .map(({ memberId, name, email, role }) => ({ memberId, name, email, role }));
}

/** Creates a delivery and queues its job (one transaction); answers at once, the job sends it later. */
export async function createDelivery(p: ProjectRow, actor: Actor, body: DeliveryRequestBody): Promise<DeliveryResponse> {
  const rev = (
    await db
      .select({ id: scheduleRevision.id, letter: scheduleRevision.letter })
      .from(scheduleRevision)
      .where(and(eq(scheduleRevision.projectId, p.id), eq(scheduleRevision.letter, body.revision)))
  )[0];
  if (!rev) throw new InvalidError("revision", `This project has no issued revision ${body.revision}; only issued revisions can be sent`);

  const recipients: DeliveryRecipient[] = [];
  const seen = new Set<string>();
  if (body.memberIds.length) {
    const choices = new Map((await deliveryMemberChoices(p)).map((c) => [c.memberId, c]));
    body.memberIds.forEach((id, i) => {
      const c = choices.get(id);
      if (!c)
        throw new InvalidError(
          `memberIds[${i}]`,
          "is not a member of this project's organisation who receives its exports (a client must have the project shared with them)",
          `Recipient ${i + 1} of the members is not someone this project's workbook can be sent to`,
        );
      const key = c.email.toLowerCase();
      if (seen.has(key)) return;
      seen.add(key);
      recipients.push({ email: c.email, name: c.name, memberId: c.memberId });
    });
  }
  for (const email of body.to) {
    const key = email.toLowerCase();
    if (seen.has(key)) continue;
    seen.add(key);
    recipients.push({ email });
  }

  const limited = await hit(deliveryLimit(), p.organizationId);
  if (!limited.allowed)
    throw new RateLimitedError(
      `Your organisation has started ${deliveryLimit().max} deliveries in the last hour, the most allowed; try again in ${Math.ceil(limited.retryAfterSeconds / 60)} minutes. Nothing was queued.`,
      limited.retryAfterSeconds,
    );

  const boss = await queue();
  const client = await pool.connect();
  let broken: Error | undefined;
  try {
    await client.query("begin");
    const tx = drizzle(client, { schema });
    const [row] = await tx
      .insert(delivery)
      .values({
        projectId: p.id,
        organizationId: p.organizationId,
        revisionId: rev.id,
        revisionLetter: rev.letter,
        recipients,
        message: body.message,
        createdById: actor.id,
        createdByName: actor.name,
      })
      .returning();
    const jobId = await boss.send(DELIVERY_QUEUE, { deliveryId: row!.id }, { ...deliveryRetry(), db: sqlOn(client) });
    const [queued] = await tx.update(delivery).set({ jobId }).where(eq(delivery.id, row!.id)).returning();
    await recordEvent(tx, {
      projectId: p.id,
      actor,
      kind: "delivery.queued",
      summary: `Queued revision ${rev.letter}'s workbook for ${recipients.length === 1 ? recipients[0]!.email : `${recipients.length} recipients`}`,
      detail: { deliveryId: row!.id, recipients: recipients.length },
    });
    await client.query("commit");
    return deliveryResponse(queued!);
  } catch (err) {
    broken = err as Error;
    await client.query("rollback").catch(() => {});
    throw err;
  } finally {
    client.release(broken && /connection|terminat|ECONN/i.test(broken.message) ? broken : undefined);
  }
}

/** One page of the project's deliveries, newest first (without attachment bytes). */
export async function deliveriesOf(projectId: string, q: PageQuery): Promise<Page<DeliveryResponse>> {
  const after = olderThanCursor(delivery.createdAt, delivery.id, q.cursor);
  const rows = await db
    .select({ d: summaryColumns, key: instantKey(delivery.createdAt) })
    .from(delivery)
    .where(and(eq(delivery.projectId, projectId), after))
    .orderBy(...newestFirst(delivery.createdAt, delivery.id))
    .limit(q.limit + 1);
  const page = pageOf(rows, q.limit, (r) => ({ key: r.key, id: r.d.id }));
  return { items: page.items.map((r) => summaryResponse(r.d)), nextCursor: page.nextCursor };
}

/** Every column but the attachment's bytes, with their size. */
const summaryColumns = {
  id: delivery.id,
  projectId: delivery.projectId,
  organizationId: delivery.organizationId,
  revisionId: delivery.revisionId,
  revisionLetter: delivery.revisionLetter,
  recipients: delivery.recipients,
  message: delivery.message,
  status: delivery.status,
  attempts: delivery.attempts,
  lastError: delivery.lastError,
  jobId: delivery.jobId,
  attachmentName: delivery.attachmentName,
  attachmentSha256: delivery.attachmentSha256,
  attachmentSize: sql<number | null>`octet_length(${delivery.attachment})`,
  messageId: delivery.messageId,
  createdById: delivery.createdById,
  createdByName: delivery.createdByName,
  createdAt: delivery.createdAt,
  updatedAt: delivery.updatedAt,
  sentAt: delivery.sentAt,
};
type SummaryRow = Omit<DeliveryRow, "attachment"> & { attachmentSize: number | null };

function summaryResponse(r: SummaryRow): DeliveryResponse {
  const { attachmentSize, ...rest } = r;
  const res = deliveryResponse({ ...rest, attachment: null });
  if (r.attachmentName && r.attachmentSha256 && attachmentSize !== null)
    res.attachment = { fileName: r.attachmentName, sha256: r.attachmentSha256, sizeBytes: Number(attachmentSize) };
  return res;
}

/** A delivery's status (without the attachment's bytes). */
export async function deliveryStatus(id: string): Promise<DeliveryResponse | null> {
  const r = (await db.select(summaryColumns).from(delivery).where(eq(delivery.id, id)))[0];
  return r ? summaryResponse(r) : null;
}

/** Several deliveries' statuses at once (the outbox polls the ones still on their way). */
export async function deliveryStatuses(ids: string[]): Promise<DeliveryResponse[]> {
  if (!ids.length) return [];
  const rows = await db.select(summaryColumns).from(delivery).where(inArray(delivery.id, ids));
  return rows.map(summaryResponse);
}

/** The exact file attached, or null while it has not been built yet. */
export async function deliveryAttachment(id: string): Promise<{ fileName: string; bytes: Buffer; sha256: string } | null> {
  const r = (
    await db
      .select({ fileName: delivery.attachmentName, bytes: delivery.attachment, sha256: delivery.attachmentSha256 })
      .from(delivery)
      .where(eq(delivery.id, id))
  )[0];
  if (!r?.fileName || !r.bytes || !r.sha256) return null;
  return { fileName: r.fileName, bytes: r.bytes, sha256: r.sha256 };
}

/** A failure that no retry can mend (the job ends at once, the delivery failed). */
class PermanentDeliveryError extends Error {}

/** The SMTP server's answer when it gave one (e.g. "550 5.1.1 mailbox unavailable"), else the error's message. */
export function deliveryErrorText(err: unknown): string {
  const e = err as { response?: unknown; message?: unknown; code?: unknown };
  const text = typeof e?.response === "string" && e.response ? e.response : typeof e?.message === "string" ? e.message : String(err);
  const code = typeof e?.code === "string" && !text.includes(e.code) ? ` (${e.code})` : "";
  return (text + code).slice(0, 1000);
}

function mailText(d: DeliveryRow, projectName: string, fileName: string): string {
  return [
    ...(d.message ? [d.message, ""] : []),
    `Attached: the glazing schedule workbook of ${projectName}, revision ${d.revisionLetter} (${fileName}).`,
    `Sent by ${d.createdByName} through Paneray.`,
    "",
    "The values in it are estimates for comparing glazing options, not certified or declared values; local codes and licensed professionals decide.",
    "",
    "— Paneray",
  ].join("\n");
}

export interface JobAttempt {
  /** Retries made before this attempt (0 on the first). */
  retryCount: number;
  /** Retries the job may make in all. */
  retryLimit: number;
}

/**
 * One attempt of a delivery job. Resolves when the message was accepted (or the delivery is gone or already
 * sent); throws the SMTP error after recording it, so that the queue retries the job with its backoff.
 */
export async function attemptDelivery(deliveryId: string, job: JobAttempt): Promise<DeliveryStatus | "gone"> {
  const d = (await db.select().from(delivery).where(eq(delivery.id, deliveryId)))[0];
  if (!d) return "gone"; // removed with its project
  // Sent and failed are final: a job that runs again (expired while its worker stopped) changes nothing.
  if (d.status === "sent" || d.status === "failed") return d.status;
  await db
    .update(delivery)
    .set({ status: "sending", attempts: sql`${delivery.attempts} + 1` })
    .where(eq(delivery.id, d.id));
  try {
    let file =
      d.attachment && d.attachmentName && d.attachmentSha256 ? { fileName: d.attachmentName, bytes: d.attachment, sha256: d.attachmentSha256 } : null;
    if (!file) {
      file = await workbookFile({ projectId: d.projectId, revision: d.revisionLetter });
      await db
        .update(delivery)
        .set({ attachmentName: file.fileName, attachment: file.bytes, attachmentSha256: file.sha256 })
        .where(eq(delivery.id, d.id));
    }
    if (!canSendMail()) throw new PermanentDeliveryError("No SMTP server is configured (SMTP_URL is not set), so the message cannot be sent");
    const projectName =
      (await db.select({ name: schema.project.name }).from(schema.project).where(eq(schema.project.id, d.projectId)))[0]?.name ?? "the project";
    const recipients = d.recipients as DeliveryRecipient[];
    const info = await sendMail({
      to: recipients.map((r) => r.email).join(", "),
      subject: `Glazing schedule ${projectName}, revision ${d.revisionLetter}`,
      text: mailText(d, projectName, file.fileName),
      attachments: [{ filename: file.fileName, content: file.bytes, contentType: XLSX_TYPE }],
    });
    await db
      .update(delivery)
      .set({ status: "sent", messageId: info?.messageId ?? null, sentAt: sql`now()`, lastError: null })
      .where(eq(delivery.id, d.id));
    return "sent";
  } catch (err) {
    const last = err instanceof PermanentDeliveryError || job.retryCount >= job.retryLimit;
    await db
      .update(delivery)
      .set({ status: last ? "failed" : "queued", lastError: deliveryErrorText(err) })
      .where(eq(delivery.id, d.id));
    if (err instanceof PermanentDeliveryError) return "failed";
    throw err;
  }
}

/**
 * Deliveries whose queue job has failed for good while the delivery still says queued or sending: the worker
 * ended during the last attempt (the job expired with no retry left, so no attempt recorded the end). They are
 * marked failed with that reason, so that the outbox never shows a delivery as on its way for ever. Returns how
 * many were marked. The queue's tables (schema pgboss) exist once any process has started the queue.
 */
export async function failAbandonedDeliveries(): Promise<number> {
  const res = await db.execute(sql`
    update delivery d
       set status = 'failed',
           last_error = coalesce(d.last_error || ' · ', '') || 'the last attempt was cut short (its worker stopped) and no retry was left',
           updated_at = now()
     where d.status in ('queued', 'sending')
       and d.job_id is not null
       and (exists (select 1 from pgboss.job j where j.id::text = d.job_id and j.state = 'failed')
            or exists (select 1 from pgboss.archive a where a.id::text = d.job_id and a.state = 'failed'))`);
  return res.rowCount ?? 0;
}
