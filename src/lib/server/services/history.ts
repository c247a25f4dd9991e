/**
 * The project's history: every decision and edit, who made it and when. Services write an event in
 * the same transaction as the change it records, so history and data never disagree.
 */
import { and, desc, eq, lt, or } from "drizzle-orm";
import { db } from "@/lib/server/db/client";
import { projectEvent, type ProjectEvent } from "@/lib/server/db/schema";

type Executor = Pick<typeof db, "insert" | "select">;

export interface Actor {
  id: string;
  name: string;
}

export interface EventInput {
  projectId: string;
  actor: Actor;
  /** e.g. "option.created", "option.approved", "requirements.updated", "revision.issued". */
  kind: string;
  /** One readable sentence, e.g. "Approved “Clear triple” for North". */
  summary: string;
  detail?: Record<string, unknown>;
}

/** Appends one event; pass the transaction that makes the change. */
export async function recordEvent(tx: Executor, e: EventInput): Promise<void> {
  await tx.insert(projectEvent).values({
    projectId: e.projectId,
    actorId: e.actor.id,
    actorName: e.actor.name,
    kind: e.kind,
    summary: e.summary,
    detail: e.detail ?? null,
  });
}

/** One page of a project's history, newest first; `before` is the last event of the previous page. */
export async function historyPage(projectId: string, limit: number, before?: { createdAt: Date; id: string }): Promise<ProjectEvent[]> {
  return db
    .select()
    .from(projectEvent)
    .where(
      before
        ? and(
            eq(projectEvent.projectId, projectId),
            or(lt(projectEvent.createdAt, before.createdAt), and(eq(projectEvent.createdAt, before.createdAt), lt(projectEvent.id, before.id))),
          )
        : eq(projectEvent.projectId, projectId),
    )
    .orderBy(desc(projectEvent.createdAt), desc(projectEvent.id))
    .limit(limit);
}
