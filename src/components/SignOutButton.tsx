import { useState } from "react";
import { authClient } from "../lib/client/auth-client";

export default function SignOutButton() {
  const [busy, setBusy] = useState(false);
  return (
    <button
      type="button"
      className="btn-quiet"
      disabled={busy}
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
