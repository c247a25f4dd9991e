import { useState } from "react";
import { api, ApiError } from "@/lib/client/api";
import { FormMessage } from "./forms/Field";
import { useHydrated } from "./forms/useHydrated";

interface Props {
  invitationId: string;
  organizationName: string;
  roleLabel: string;
  invitedEmail: string;
  userEmail: string;
}

export default function AcceptInvitation(p: Props) {
  const hydrated = useHydrated();
  const [busy, setBusy] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  if (p.invitedEmail.toLowerCase() !== p.userEmail.toLowerCase()) {
    return (
      <FormMessage kind="error">
        You are signed in as {p.userEmail}, but this invitation is for {p.invitedEmail}. Sign out and sign in (or sign up) with that address.
      </FormMessage>
    );
  }
  return (
    <div className="space-y-3">
      {failure && <FormMessage kind="error">{failure}</FormMessage>}
      <button
        type="button"
        className="btn"
        disabled={!hydrated || busy}
        onClick={async () => {
          setBusy(true);
          setFailure(null);
          try {
            await api("POST", `/api/v1/invitations/${p.invitationId}/accept`);
            window.location.assign("/dashboard");
          } catch (e) {
            setFailure(e instanceof ApiError ? e.message : String(e));
            setBusy(false);
          }
        }}
      >
        Join {p.organizationName} as {p.roleLabel}
      </button>
    </div>
  );
}
