/** View model of a project's outbox: its issued revisions and who may receive its workbook. */
import { permissionFor } from "@/lib/auth/roles";
import type { DeliveryMemberChoice } from "@/lib/contracts/deliveries";
import { requireProject, type ProjectRow } from "@/lib/server/services/access";
import { deliveryMemberChoices } from "@/lib/server/services/deliveries";
import { revisionListOf } from "@/lib/server/services/revisions";

export interface OutboxPageView {
  project: ProjectRow;
  revisions: { letter: string; issuedAt: string }[];
  members: DeliveryMemberChoice[];
}

/** Owners and consultants (export:create); others get the 403 page, non-members 404. */
export async function loadOutboxPage(user: { id: string }, projectId: string | undefined): Promise<OutboxPageView> {
  const { project } = await requireProject(user.id, projectId ?? "", permissionFor("export:create"), "send schedules from the outbox");
  const revisions = (await revisionListOf(project.id)).map((r) => ({ letter: r.letter, issuedAt: r.issuedAt }));
  return { project, revisions, members: await deliveryMemberChoices(project) };
}
