import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { PaneImportResponse } from "@/lib/contracts/library";
import { endpoint, jsonOf, problem } from "@/lib/server/http";
import { readUploadedFile } from "@/lib/server/upload-body";
import { validatePanesCsv } from "@/lib/server/uploads/panes-csv";
import { importPanes } from "@/lib/server/services/uploads";

const params = z.object({ orgId: rowId });

/**
 * Measured panes from a CSV file (multipart/form-data, field `file`): 201 with every pane saved and the file's
 * SHA-256, or 400 listing every problem with its line and column (nothing saved).
 */
export const POST = endpoint({ auth: { org: "orgId", permission: "glazing:create" }, params }, async ({ params, user, request }) => {
  const file = await readUploadedFile(request, { fallbackName: "panes.csv" });
  const checked = validatePanesCsv(file.bytes);
  if (!checked.ok) {
    const n = checked.errors.length;
    return problem(
      400,
      `The file has ${n === 1 ? "a problem" : `${n} problems`}; nothing was saved. Fix ${n === 1 ? "it" : "them"} and upload it again.`,
      {
        errors: checked.errors as never,
      },
    );
  }
  const saved = await importPanes(params.orgId, { id: user.id, name: user.name }, file, checked.panes);
  return jsonOf(PaneImportResponse, { panes: saved.panes, upload: saved.upload, sha256: file.sha256 }, 201);
});
