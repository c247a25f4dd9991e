import { useState } from "react";
import { api, ApiError } from "@/lib/client/api";
import { useHydrated } from "./forms/useHydrated";

export default function DeleteProjectButton({ projectId, projectName }: { projectId: string; projectName: string }) {
  const hydrated = useHydrated();
  const [busy, setBusy] = useState(false);
  return (
    <button
      type="button"
      className="btn-danger"
      disabled={!hydrated || busy}
      onClick={async () => {
        if (!window.confirm(`Delete "${projectName}" with all its façades? This cannot be undone.`)) return;
        setBusy(true);
        try {
          await api("DELETE", `/api/v1/projects/${projectId}`);
          window.location.assign("/dashboard");
        } catch (e) {
          window.alert(e instanceof ApiError ? e.message : String(e));
          setBusy(false);
        }
      }}
    >
      Delete
    </button>
  );
}
