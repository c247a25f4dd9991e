import { useState } from "react";
import type { ShareEntry } from "@/lib/contracts/projects";
import { api, ApiError } from "@/lib/client/api";
import { FormMessage } from "./forms/Field";

type Share = ShareEntry;

/** Ticks which clients (members who see only shared projects) see this project. */
export default function ShareManager({ projectId, initial }: { projectId: string; initial: Share[] }) {
  const [shares, setShares] = useState(initial);
  const [busy, setBusy] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  if (shares.length === 0)
    return <p className="text-sm text-slate">There are no client members in this organisation yet. Invite them from the Members page.</p>;
  return (
    <div className="space-y-2">
      {failure && <FormMessage kind="error">{failure}</FormMessage>}
      <ul className="divide-y divide-line">
        {shares.map((s) => (
          <li key={s.memberId} className="flex items-center gap-3 py-2">
            <input
              id={`share-${s.memberId}`}
              type="checkbox"
              className="mt-0 w-auto"
              checked={s.shared}
              disabled={busy === s.memberId}
              onChange={async (e) => {
                setBusy(s.memberId);
                setFailure(null);
                try {
                  const res = e.target.checked
                    ? await api<{ shares: Share[] }>("POST", `/api/v1/projects/${projectId}/shares`, { memberId: s.memberId })
                    : await api<{ shares: Share[] }>("DELETE", `/api/v1/projects/${projectId}/shares/${s.memberId}`);
                  setShares(res.shares);
                } catch (err) {
                  setFailure(err instanceof ApiError ? err.message : String(err));
                } finally {
                  setBusy(null);
                }
              }}
            />
            <label htmlFor={`share-${s.memberId}`} className="font-normal text-ink">
              {s.name} <span className="text-slate">· {s.email}</span>
            </label>
          </li>
        ))}
      </ul>
    </div>
  );
}
