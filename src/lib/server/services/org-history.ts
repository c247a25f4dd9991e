/**
 * The organisation's history: changes to the organisation as a whole (its API keys), who made them and
 * when. Services write an event in the same transaction as the change it records.
 */
import { and, eq } from "drizzle-orm";
import { db } from "@/lib/server/db/client";
import { organizationEvent } from "@/lib/server/db/schema";
import { pageOf, type Page, type PageQuery } from "@/lib/contracts/pagination";
import { instantKey, newestFirst, olderThanCursor } from "@/lib/server/db/newest-first";
import type { OrganizationEventEntry } from "@/lib/contracts/api-keys";
import type { Actor } from "./history";

type Executor = Pick<typeof db, "insert" | "select">;

export interface OrgEventInput {
  organizationId: string;
  actor: Actor;
  /** e.g. "api-key.created", "api-key.revoked". */
  kind: string;
  summary: string;
  detail?: Record<string, unknown>;
}

/** Appends one event; pass the transaction that makes the change. */
export async function recordOrgEvent(tx: Executor, e: OrgEventInput): Promise<void> {
  await tx.insert(organizationEvent).values({
    organizationId: e.organizationId,
    actorId: e.actor.id,
    actorName: e.actor.name,
    kind: e.kind,
    summary: e.summary,
    detail: e.detail ?? null,
  });
}

/** One page of the organisation's history, newest first. */
export async function orgHistoryOf(organizationId: string, q: PageQuery): Promise<Page<OrganizationEventEntry>> {
  const after = olderThanCursor(organizationEvent.createdAt, organizationEvent.id, q.cursor);
  const rows = await db
    .select({ e: organizationEvent, key: instantKey(organizationEvent.createdAt) })
    .from(organizationEvent)
    .where(and(eq(organizationEvent.organizationId, organizationId), after))
    .orderBy(...newestFirst(organizationEvent.createdAt, organizationEvent.id))
    .limit(q.limit + 1);
  const page = pageOf(rows, q.limit, (r) => ({ key: r.key, id: r.e.id }));
  return {
    items: page.items.map(({ e }) => ({ id: e.id, kind: e.kind, summary: e.summary, actorName: e.actorName, createdAt: e.createdAt.toISOString() })),
    nextCursor: page.nextCursor,
  };
}
