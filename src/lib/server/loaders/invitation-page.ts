/** View model of the page an invitation link opens. */
import { ROLE_LABELS, ROLE_SUMMARIES } from "@/lib/auth/roles";
import { rowId } from "@/lib/contracts/common";
import { NotFoundError } from "@/lib/server/errors";
import { accountExists } from "@/lib/server/services/accounts";
import { invitationSummary, type InvitationSummary } from "@/lib/server/services/members";

export interface InvitationPage {
  invitation: InvitationSummary;
  roleLabel: string;
  roleSummary: string;
  /** For a visitor not signed in: whether the invited address already has an account (sign in rather than sign up). */
  hasAccount: boolean;
}

/** NotFoundError for an unknown or malformed invitation id. */
export async function loadInvitationPage(user: { id: string } | null, invitationId: string | undefined): Promise<InvitationPage> {
  const id = invitationId ?? "";
  const invitation = rowId.safeParse(id).success ? await invitationSummary(id) : null;
  if (!invitation) throw new NotFoundError("No such invitation");
  return {
    invitation,
    roleLabel: ROLE_LABELS[invitation.role],
    roleSummary: ROLE_SUMMARIES[invitation.role],
    hasAccount: user ? false : await accountExists(invitation.email),
  };
}
