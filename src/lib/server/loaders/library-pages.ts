/** View models of the glazing pages: the composer's library bar and the library page. */
import { roleCan } from "@/lib/auth/roles";
import { membershipsOf } from "@/lib/server/services/access";
import { makeupsPage, panesPage } from "@/lib/server/services/library";
import type { MakeupEntry, PaneEntry } from "@/lib/contracts/library";
import { ForbiddenError } from "@/lib/server/errors";

export interface LibraryRef {
  organizationId: string;
  organizationName: string;
  canSave: boolean;
  canDelete: boolean;
}

/** The first of the user's organisations whose library they may read (null: none, e.g. a client). */
export async function libraryOf(user: { id: string }): Promise<LibraryRef | null> {
  const m = (await membershipsOf(user.id)).find((x) => roleCan(x.role, { glazing: ["read"] }));
  if (!m) return null;
  return {
    organizationId: m.organizationId,
    organizationName: m.organizationName,
    canSave: roleCan(m.role, { glazing: ["create"] }),
    canDelete: roleCan(m.role, { glazing: ["delete"] }),
  };
}

export interface LibraryPage {
  library: LibraryRef;
  makeups: MakeupEntry[];
  panes: PaneEntry[];
  /** More than the first hundred make-ups exist (the page then says so). */
  more: boolean;
}

export async function loadLibraryPage(user: { id: string }): Promise<LibraryPage> {
  const library = await libraryOf(user);
  if (!library) throw new ForbiddenError("Your role does not include the glazing library: it is kept by owners, consultants and architects.");
  const [makeups, panes] = await Promise.all([
    makeupsPage(library.organizationId, { limit: 100 }),
    panesPage(library.organizationId, { limit: 100 }),
  ]);
  return { library, makeups: makeups.items, panes: panes.items, more: makeups.nextCursor !== null };
}
