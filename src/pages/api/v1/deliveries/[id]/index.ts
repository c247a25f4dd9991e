import { DeliveryStatusResponse } from "@/lib/contracts/deliveries";
import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { endpoint, jsonOf } from "@/lib/server/http";
import { NotFoundError } from "@/lib/server/errors";
import { deliveryStatus } from "@/lib/server/services/deliveries";

const params = z.object({ id: rowId });

/** A delivery's status, attempts, last error and attachment (its name, size and SHA-256). */
export const GET = endpoint({ auth: { delivery: "id", permission: "export:create" }, params }, async ({ deliveryId }) => {
  const d = await deliveryStatus(deliveryId);
  if (!d) throw new NotFoundError("No such delivery, or its project is not shared with you");
  return jsonOf(DeliveryStatusResponse, { delivery: d });
});
