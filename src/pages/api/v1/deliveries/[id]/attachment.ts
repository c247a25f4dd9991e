import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { endpoint } from "@/lib/server/http";
import { NotFoundError } from "@/lib/server/errors";
import { deliveryAttachment, XLSX_TYPE } from "@/lib/server/services/deliveries";

const params = z.object({ id: rowId });

/** The exact workbook the delivery attached (404 until the worker has built it). */
export const GET = endpoint({ auth: { delivery: "id", permission: "export:create" }, params }, async ({ deliveryId }) => {
  const file = await deliveryAttachment(deliveryId);
  if (!file) throw new NotFoundError("This delivery's workbook has not been built yet; it is made when the first attempt starts");
  return new Response(new Uint8Array(file.bytes), {
    status: 200,
    headers: {
      "content-type": XLSX_TYPE,
      "content-length": String(file.bytes.length),
      "content-disposition": `attachment; filename="${file.fileName.replace(/[^\w.-]/g, "_")}"`,
      "cache-control": "private, no-store",
      "x-content-sha256": file.sha256,
    },
  });
});
