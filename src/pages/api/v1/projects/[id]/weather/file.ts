import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { endpoint } from "@/lib/server/http";
import { weatherFileOf } from "@/lib/server/services/uploads";

const params = z.object({ id: rowId });

/** The weather file exactly as it was uploaded, with its SHA-256 in a header. */
export const GET = endpoint({ auth: { project: "id", permission: "project:readAll" }, params }, async ({ project }) => {
  const f = await weatherFileOf(project.id);
  const ascii = f.fileName.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  return new Response(new Uint8Array(f.content), {
    status: 200,
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(f.fileName)}`,
      "x-content-sha256": f.sha256,
      "cache-control": "no-store",
      "x-content-type-options": "nosniff",
    },
  });
});
