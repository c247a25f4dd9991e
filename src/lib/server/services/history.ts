/**
 * The project's history: every decision and edit, who made it and when. Services write an event in
 * the same transaction as the change it records, so history and data never disagree. It is read through
 * historyOf in review.ts.
 */
import { db } from "@/lib/server/db/client";
import { projectEvent } from "@/lib/server/db/schema";

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
