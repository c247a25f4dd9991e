/** Comments on façade options, approvals and rejections, and the project's history: requests and wire types. */
import { z } from "./zod";
import { optionalText, rowId, text } from "./common";

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

export interface CommentView {
  id: string;
  optionId: string;
  parentId: string | null;
  author: { id: string | null; name: string };
  body: string;
  createdAt: string;
}

export interface DecisionView {
  id: string;
  optionId: string;
  decision: "approved" | "rejected";
  note: string | null;
  decidedBy: string;
  at: string;
}

export interface OptionStatusView {
  id: string;
  facadeId: string;
  name: string;
  status: "proposed" | "approved" | "rejected";
  version: number;
}

export interface DecisionResponse {
  option: OptionStatusView;
  /** The option of the same façade that was approved before and is now back to "proposed". */
  previouslyApproved?: OptionStatusView;
  decisions: DecisionView[];
}

export interface HistoryItem {
  id: string;
  kind: string;
  summary: string;
  actor: string;
  at: string;
  detail: unknown;
}
export interface HistoryResponse {
  items: HistoryItem[];
  nextCursor: string | null;
}
