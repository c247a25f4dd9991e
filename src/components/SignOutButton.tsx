import { useState } from "react";
import { authClient } from "@/lib/client/auth-client";
import { useHydrated } from "./forms/useHydrated";

export default function SignOutButton() {
  const hydrated = useHydrated();
  const [busy, setBusy] = useState(false);
  return (
    <button
      type="button"
      className="btn-quiet"
      disabled={!hydrated || busy}
      onClick={async () => {
        setBusy(true);
        await authClient.signOut().catch(() => {});
        window.location.assign("/signin");
      }}
    >
      Sign out
    </button>
  );
}
