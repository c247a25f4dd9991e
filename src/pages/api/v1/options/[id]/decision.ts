import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { DecisionRequest, DecisionResponse } from "@/lib/contracts/review";
import { endpoint, jsonOf } from "@/lib/server/http";
import { decide } from "@/lib/server/services/review";

const params = z.object({ id: rowId });

/** Approves or rejects the option; approving replaces the façade's previously approved option. */
export const POST = endpoint(
  { auth: { option: "id", permission: "option:review" }, params, body: DecisionRequest, maxBytes: 16 * 1024 },
  async ({ option, user, body }) => jsonOf(DecisionResponse, await decide(option.id, { id: user.id, name: user.name }, body)),
);
