/** Comments on façade options, approvals and rejections, and the project's history: requests and wire types. */
import { z } from "./zod";
import { optionalText, rowId, text } from "./common";
import { id, instant, nextCursor } from "./wire";

export const COMMENT_MAX = 5000;
export const DECISION_NOTE_MAX = 2000;

export const CommentRequest = z.object({
  body: text("Comment", COMMENT_MAX, { multiline: true }),
  parentId: rowId.optional().nullable(),
});
export type CommentRequest = z.infer<typeof CommentRequest>;

export const DecisionRequest = z.object({
  decision: z.enum(["approved", "rejected"], { error: "Decision must be “approved” or “rejected”" }),
  note: optionalText("Note", DECISION_NOTE_MAX, { multiline: true }).optional(),
});
export type DecisionRequest = z.infer<typeof DecisionRequest>;

// ---- responses ------------------------------------------------------------------------------------------------

const optionStatus = z.enum(["proposed", "approved", "rejected"]);

export const CommentView = z.object({
  id,
  optionId: id,
  parentId: z.string().nullable().describe("The comment this one answers"),
  author: z.object({ id: z.string().nullable(), name: z.string() }),
  body: z.string(),
  createdAt: instant,
});
export type CommentView = z.output<typeof CommentView>;

export const DecisionView = z.object({
  id,
  optionId: id,
  decision: z.enum(["approved", "rejected"]),
  note: z.string().nullable(),
  decidedBy: z.string(),
  at: instant,
});
export type DecisionView = z.output<typeof DecisionView>;

export const OptionStatusView = z.object({ id, facadeId: id, name: z.string(), status: optionStatus, version: z.number().int() });
export type OptionStatusView = z.output<typeof OptionStatusView>;

export const DecisionResponse = z.object({
  option: OptionStatusView,
  previouslyApproved: OptionStatusView.optional().describe("The option of the same façade approved before, now back to proposed"),
  decisions: z.array(DecisionView),
});
export type DecisionResponse = z.output<typeof DecisionResponse>;

export const HistoryItem = z.object({
  id,
  kind: z.string().describe('What happened, e.g. "option.approved"'),
  summary: z.string(),
  actor: z.string(),
  at: instant,
  detail: z.unknown(),
});
export type HistoryItem = z.output<typeof HistoryItem>;

export const HistoryResponse = z.object({ items: z.array(HistoryItem).describe("Newest first"), nextCursor });
export type HistoryResponse = z.output<typeof HistoryResponse>;

export const CommentsResponse = z.object({
  status: optionStatus,
  comments: z.array(CommentView).describe("Oldest first"),
  decisions: z.array(DecisionView),
});
