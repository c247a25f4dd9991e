import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { DeliveryCreatedResponse, DeliveryPageResponse, DeliveryRequest } from "@/lib/contracts/deliveries";
import { InstantPageQuery, queryOf } from "@/lib/contracts/pagination";
import { endpoint, jsonOf } from "@/lib/server/http";
import { createDelivery, deliveriesOf } from "@/lib/server/services/deliveries";

const params = z.object({ id: rowId });

/** One page (`?limit=`, `?cursor=`) of the project's deliveries, newest first, with status and attempts. */
export const GET = endpoint({ auth: { project: "id", permission: "export:create" }, params }, async ({ project, context }) => {
  const page = await deliveriesOf(project.id, InstantPageQuery.parse(queryOf(context.url)));
  return jsonOf(DeliveryPageResponse, { deliveries: page.items, nextCursor: page.nextCursor });
});

/** Queues an e-mail of an issued revision's workbook; answers 202 at once, the job worker sends it. */
export const POST = endpoint(
  { auth: { project: "id", permission: "export:create" }, params, body: DeliveryRequest },
  async ({ project, user, body }) => {
    const d = await createDelivery(project, { id: user.id, name: user.name }, body);
    return jsonOf(DeliveryCreatedResponse, { id: d.id, status: d.status, delivery: d }, 202, { location: `/api/v1/deliveries/${d.id}` });
  },
);
