import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { MakeupDetailResponse, MakeupEntry, MakeupPatchRequest } from "@/lib/contracts/library";
import { endpoint, jsonOf } from "@/lib/server/http";
import { InvalidError } from "@/lib/server/errors";
import { deleteMakeup, getMakeup, makeupRevisions, optionsUsingMakeup, updateMakeup } from "@/lib/server/services/library";

const params = z.object({ id: rowId });

/** A saved make-up at its current revision (or `?revision=N`), with its revision history and the options that use it. */
export const GET = endpoint({ auth: { makeup: "id", permission: "glazing:read" }, params }, async ({ params, context }) => {
  const raw = context.url.searchParams.get("revision");
  let revision: number | undefined;
  if (raw !== null) {
    if (!/^\d{1,6}$/.test(raw) || Number(raw) < 1) throw new InvalidError("revision", "revision must be a whole number from 1");
    revision = Number(raw);
  }
  const [entry, revisions, usedBy] = await Promise.all([getMakeup(params.id, revision), makeupRevisions(params.id), optionsUsingMakeup(params.id)]);
  return jsonOf(MakeupDetailResponse, { ...entry, revisions, usedBy });
});

/** Saves a new revision; `revision` is the one the change was based on (409 when someone saved meanwhile). */
export const PATCH = endpoint(
  { auth: { makeup: "id", permission: "glazing:update" }, params, body: MakeupPatchRequest, maxBytes: 64 * 1024, engineErrorsField: "layers" },
  async ({ params, body, user }) => jsonOf(MakeupEntry, await updateMakeup(params.id, { id: user.id, name: user.name }, body)),
);

/** Deletes the make-up and its revisions; 409 naming the options when any uses it. */
export const DELETE = endpoint({ auth: { makeup: "id", permission: "glazing:delete" }, params }, async ({ params }) => {
  await deleteMakeup(params.id);
  return new Response(null, { status: 204 });
});
