import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { CommentRequest, CommentView, CommentsResponse } from "@/lib/contracts/review";
import { endpoint, jsonOf } from "@/lib/server/http";
import { addComment, commentsOf, decisionsOf } from "@/lib/server/services/review";

const params = z.object({ id: rowId });

/** The option's comment thread, oldest first (each comment names its parent), with its status and decisions. */
export const GET = endpoint({ auth: { option: "id", permission: "project:readAll" }, params }, async ({ option }) =>
  jsonOf(CommentsResponse, { status: option.status, comments: await commentsOf(option.id), decisions: await decisionsOf(option.id) }),
);

export const POST = endpoint(
  { auth: { option: "id", permission: "comment:create" }, params, body: CommentRequest, maxBytes: 64 * 1024 },
  async ({ option, user, body }) => jsonOf(CommentView, await addComment(option, { id: user.id, name: user.name }, body), 201),
);
