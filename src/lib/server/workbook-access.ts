/** What the workbook downloads share: the draft's access rule and the download headers. */
import { permissionFor, roleCan } from "@/lib/auth/roles";
import { ForbiddenError } from "@/lib/server/errors";
import type { Membership } from "@/lib/server/services/access";

/** The current draft is for the roles that make exports (owners and consultants); others get issued revisions. */
export function requireDraftAccess(m: Membership): void {
  if (!roleCan(m.role, permissionFor("export:create")))
    throw ForbiddenError.forRole(m.role, "download the draft workbook; choose an issued revision (?revision=A)");
}

/** Content type, attachment with its (ASCII) file name, no caching. */
export function workbookHeaders(fileName: string, contentType: string): Headers {
  const safe = fileName.replace(/[^\w.-]/g, "_");
  return new Headers({
    "content-type": contentType,
    "content-disposition": `attachment; filename="${safe}"`,
    "cache-control": "no-store",
    "x-content-type-options": "nosniff",
  });
}
