import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { InvitationRequest, type InvitationEntry, type MemberEntry } from "@/lib/contracts/auth";
import { ASSIGNABLE_ROLES, ROLE_LABELS, isRoleName } from "@/lib/auth/roles";
import { api, ApiError } from "@/lib/client/api";
import { applyServerErrors, Field, FormMessage } from "./forms/Field";
import { useHydrated } from "./forms/useHydrated";

type Member = MemberEntry;
type Invitation = InvitationEntry;
interface Props {
  organizationId: string;
  currentUserId: string;
  initialMembers: Member[];
  initialInvitations: Invitation[];
}

const label = (r: string | null) => (r && isRoleName(r) ? ROLE_LABELS[r] : (r ?? "—"));
const date = (s: string) => new Date(s).toLocaleDateString("en-GB", { dateStyle: "medium" });

export default function MembersManager({ organizationId, currentUserId, initialMembers, initialInvitations }: Props) {
  const hydrated = useHydrated();
  const [members, setMembers] = useState(initialMembers);
  const [invitations, setInvitations] = useState(initialInvitations);
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const base = `/api/v1/orgs/${organizationId}`;
  const { register, handleSubmit, formState, reset, setError } = useForm<InvitationRequest>({
    resolver: zodResolver(InvitationRequest),
    defaultValues: { email: "", role: "consultant" },
  });

  const run = async (fn: () => Promise<void>) => {
    setMessage(null);
    try {
      await fn();
    } catch (e) {
      setMessage({ kind: "error", text: e instanceof ApiError ? e.message : String(e) });
    }
  };

  const onInvite = handleSubmit(async (v) => {
    setMessage(null);
    try {
      const res = await api<{ invitations: Invitation[] }>("POST", `${base}/invitations`, v);
      setInvitations(res.invitations);
      setMessage({ kind: "ok", text: `Invitation sent to ${v.email}.` });
      reset({ email: "", role: v.role });
    } catch (e) {
      const err = e instanceof ApiError ? e : new ApiError(0, String(e));
      applyServerErrors(err.errors, ["email", "role"], setError);
      setMessage({ kind: "error", text: err.message });
    }
  });

  return (
    <div className="space-y-6">
      {message && <FormMessage kind={message.kind}>{message.text}</FormMessage>}
      <section className="card space-y-3">
        <h2>Invite someone</h2>
        <form method="post" onSubmit={onInvite} className="grid items-end gap-3 md:grid-cols-[1fr_200px_auto]" noValidate>
          <Field label="E-mail" htmlFor="invite-email" error={formState.errors.email}>
            <input id="invite-email" type="email" {...register("email")} />
          </Field>
          <Field label="Role" htmlFor="invite-role" error={formState.errors.role}>
            <select id="invite-role" {...register("role")}>
              {ASSIGNABLE_ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_LABELS[r]}
                </option>
              ))}
            </select>
          </Field>
          <button type="submit" className="btn mb-0.5" disabled={!hydrated || formState.isSubmitting}>
            {formState.isSubmitting ? "Sending…" : "Send invitation"}
          </button>
        </form>
      </section>

      <section className="card">
        <h2 className="mb-3">People</h2>
        <table className="w-full text-sm" data-testid="members-table">
          <thead className="text-left text-slate">
            <tr>
              <th className="py-1">Name</th>
              <th>E-mail</th>
              <th>Role</th>
              <th>Joined</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {members.map((m) => (
              <tr key={m.memberId} className="border-t border-line" data-testid="member-row">
                <td className="py-2">
                  {m.name}
                  {m.userId === currentUserId && <span className="text-slate"> (you)</span>}
                </td>
                <td>{m.email}</td>
                <td>
                  <select
                    aria-label={`Role of ${m.name}`}
                    className="mt-0 w-40 py-1"
                    value={m.role}
                    onChange={(e) =>
                      run(async () => {
                        const res = await api<{ members: Member[] }>("PATCH", `${base}/members/${m.memberId}`, { role: e.target.value });
                        setMembers(res.members);
                        setMessage({ kind: "ok", text: `${m.name} is now ${label(e.target.value)}.` });
                      })
                    }
                  >
                    {ASSIGNABLE_ROLES.map((r) => (
                      <option key={r} value={r}>
                        {ROLE_LABELS[r]}
                      </option>
                    ))}
                  </select>
                </td>
                <td>{date(m.joinedAt)}</td>
                <td className="text-right">
                  {m.userId !== currentUserId && (
                    <button
                      type="button"
                      className="btn-danger"
                      onClick={() =>
                        window.confirm(`Remove ${m.name} from the organisation?`) &&
                        run(async () => {
                          const res = await api<{ members: Member[] }>("DELETE", `${base}/members/${m.memberId}`);
                          setMembers(res.members);
                        })
                      }
                    >
                      Remove
                    </button>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>

      <section className="card">
        <h2 className="mb-3">Pending invitations</h2>
        {invitations.length === 0 ? (
          <p className="text-sm text-slate">None.</p>
        ) : (
          <ul className="divide-y divide-line text-sm" data-testid="invitations">
            {invitations.map((i) => (
              <li key={i.id} className="flex items-center gap-3 py-2">
                <span className="font-bold">{i.email}</span>
                <span className="badge">{label(i.role)}</span>
                <span className="text-slate">
                  expires {date(i.expiresAt)}
                  {i.inviterName && ` · invited by ${i.inviterName}`}
                </span>
                <button
                  type="button"
                  className="btn-quiet ml-auto"
                  onClick={() =>
                    run(async () => {
                      const res = await api<{ invitations: Invitation[] }>("DELETE", `${base}/invitations/${i.id}`);
                      setInvitations(res.invitations);
                    })
                  }
                >
                  Cancel
                </button>
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
