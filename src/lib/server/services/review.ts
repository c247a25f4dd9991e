/**
 * Review of façade options: threaded comments, approvals and rejections (one approved option per
 * façade), and the project's history read page by page. Every change records a history event in the
 * same transaction.
 */
import { and, asc, eq, ne, sql } from "drizzle-orm";
import { db } from "@/lib/server/db/client";
import { facade, facadeOption, optionComment, optionDecision, projectEvent, type FacadeOption } from "@/lib/server/db/schema";
import { ConflictError, InvalidError } from "@/lib/server/errors";
import { recordEvent, type Actor } from "./history";
import type {
  CommentRequest,
  CommentView,
  DecisionRequest,
  DecisionResponse,
  DecisionView,
  HistoryItem,
  OptionStatusView,
} from "@/lib/contracts/review";
import { pageOf, type Page, type PageQuery } from "@/lib/contracts/pagination";
import { instantKey, newestFirst, olderThanCursor } from "@/lib/server/db/newest-first";

const iso = (d: Date) => d.toISOString();

const commentView = (c: typeof optionComment.$inferSelect): CommentView => ({
  id: c.id,
  optionId: c.optionId,
  parentId: c.parentId,
  author: { id: c.authorId, name: c.authorName },
  body: c.body,
  createdAt: iso(c.createdAt),
});

const decisionView = (d: typeof optionDecision.$inferSelect): DecisionView => ({
  id: d.id,
  optionId: d.optionId,
  decision: d.decision,
  note: d.note,
  decidedBy: d.decidedByName,
  at: iso(d.createdAt),
});

const statusView = (o: FacadeOption): OptionStatusView => ({ id: o.id, facadeId: o.facadeId, name: o.name, status: o.status, version: o.version });

/** The option's comments, oldest first, each with its parent (null for a thread's first comment). */
export async function commentsOf(optionId: string): Promise<CommentView[]> {
  const rows = await db
    .select()
    .from(optionComment)
    .where(eq(optionComment.optionId, optionId))
    .orderBy(asc(optionComment.createdAt), asc(optionComment.id));
  return rows.map(commentView);
}

export async function addComment(option: FacadeOption, actor: Actor, req: CommentRequest): Promise<CommentView> {
  return db.transaction(async (tx) => {
    if (req.parentId) {
      const parent = (await tx.select({ optionId: optionComment.optionId }).from(optionComment).where(eq(optionComment.id, req.parentId)))[0];
      if (!parent || parent.optionId !== option.id)
        throw new InvalidError(
          "parentId",
          "The comment replied to must belong to this option",
          "Reply: the comment replied to is not a comment of this option",
        );
    }
    const [row] = await tx
      .insert(optionComment)
      .values({ optionId: option.id, parentId: req.parentId ?? null, authorId: actor.id, authorName: actor.name, body: req.body })
      .returning();
    await recordEvent(tx, {
      projectId: option.projectId,
      actor,
      kind: req.parentId ? "comment.replied" : "comment.created",
      summary: `${req.parentId ? "Replied on" : "Commented on"} “${option.name}”`,
      detail: { optionId: option.id, commentId: row!.id },
    });
    return commentView(row!);
  });
}

export async function decisionsOf(optionId: string): Promise<DecisionView[]> {
  const rows = await db
    .select()
    .from(optionDecision)
    .where(eq(optionDecision.optionId, optionId))
    .orderBy(asc(optionDecision.createdAt), asc(optionDecision.id));
  return rows.map(decisionView);
}

const isUniqueViolation = (err: unknown) => {
  for (let e: unknown = err; e && typeof e === "object"; e = (e as { cause?: unknown }).cause) {
    if ((e as { code?: unknown }).code === "23505") return true;
  }
  return false;
};

/**
 * Approves or rejects an option. Approving un-approves the façade's previously approved option (back
 * to "proposed") in the same transaction; the façade row is locked first so that concurrent approvals
 * of one façade run one after the other, and the unique partial index backs that up.
 */
export async function decide(optionId: string, actor: Actor, req: DecisionRequest): Promise<DecisionResponse> {
  try {
    return await db.transaction(async (tx) => {
      const o0 = (await tx.select().from(facadeOption).where(eq(facadeOption.id, optionId)))[0];
      if (!o0) throw new ConflictError("The option was deleted meanwhile");
      await tx.select({ id: facade.id }).from(facade).where(eq(facade.id, o0.facadeId)).for("update");
      const option = (await tx.select().from(facadeOption).where(eq(facadeOption.id, optionId)))[0]!;
      const facadeName = (await tx.select({ name: facade.name }).from(facade).where(eq(facade.id, option.facadeId)))[0]?.name ?? "its façade";
      let previous: FacadeOption | undefined;
      if (req.decision === "approved") {
        [previous] = await tx
          .update(facadeOption)
          .set({ status: "proposed", version: sql`${facadeOption.version} + 1` })
          .where(and(eq(facadeOption.facadeId, option.facadeId), eq(facadeOption.status, "approved"), ne(facadeOption.id, option.id)))
          .returning();
      }
      const [updated] = await tx
        .update(facadeOption)
        .set({ status: req.decision, version: sql`${facadeOption.version} + 1` })
        .where(eq(facadeOption.id, option.id))
        .returning();
      await tx
        .insert(optionDecision)
        .values({ optionId: option.id, decision: req.decision, note: req.note ?? null, decidedById: actor.id, decidedByName: actor.name });
      const verb = req.decision === "approved" ? "Approved" : "Rejected";
      await recordEvent(tx, {
        projectId: option.projectId,
        actor,
        kind: `option.${req.decision}`,
        summary: `${verb} “${option.name}” for ${facadeName}${previous ? ` (replacing “${previous.name}”)` : ""}`,
        detail: { optionId: option.id, facadeId: option.facadeId, note: req.note ?? null, previouslyApproved: previous?.id ?? null },
      });
      const decisions = (
        await tx
          .select()
          .from(optionDecision)
          .where(eq(optionDecision.optionId, option.id))
          .orderBy(asc(optionDecision.createdAt), asc(optionDecision.id))
      ).map(decisionView);
      return { option: statusView(updated!), ...(previous ? { previouslyApproved: statusView(previous) } : {}), decisions };
    });
  } catch (err) {
    if (isUniqueViolation(err)) throw new ConflictError("Another option of this façade was approved at the same moment; reload and decide again");
    throw err;
  }
}

/** One page of the project's history, newest first. */
export async function historyOf(projectId: string, q: PageQuery): Promise<Page<HistoryItem>> {
  const after = olderThanCursor(projectEvent.createdAt, projectEvent.id, q.cursor);
  const rows = await db
    .select({ e: projectEvent, key: instantKey(projectEvent.createdAt) })
    .from(projectEvent)
    .where(and(eq(projectEvent.projectId, projectId), after))
    .orderBy(...newestFirst(projectEvent.createdAt, projectEvent.id))
    .limit(q.limit + 1);
  const page = pageOf(rows, q.limit, (r) => ({ key: r.key, id: r.e.id }));
  return {
    items: page.items.map(({ e }) => ({ id: e.id, kind: e.kind, summary: e.summary, actor: e.actorName, at: iso(e.createdAt), detail: e.detail })),
    nextCursor: page.nextCursor,
  };
}
