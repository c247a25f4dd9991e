import { useEffect, useRef, useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import {
  ApiKeyCreateRequest,
  KEY_SCOPE_SUMMARIES,
  type ApiKeyCreatedResponse,
  type ApiKeyEntry,
  type ApiKeyListResponse,
  type OrganizationEventEntry,
  type OrganizationHistoryResponse,
} from "@/lib/contracts/api-keys";
import { KEY_SCOPES } from "@/lib/auth/route-table";
import { api, ApiError } from "@/lib/client/api";
import { withQueryClient } from "@/lib/client/query";
import { applyServerErrors, Field, FormMessage } from "./forms/Field";
import { useHydrated } from "./forms/useHydrated";

interface Props {
  organizationId: string;
  initialKeys: ApiKeyEntry[];
  initialEvents: OrganizationEventEntry[];
}

const SCOPE_LABELS = { read: "Read", calculate: "Calculate", "read-write": "Read and write" } as const;

/** Date and time in UTC, the same on the server and in every browser. */
const when = (s: string) => `${new Date(s).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" })} UTC`;

/** The organisation's API keys: make one (shown once), list them, revoke one after an in-page confirmation; the history below. */
function ApiKeysManager({ organizationId, initialKeys, initialEvents }: Props) {
  const hydrated = useHydrated();
  const qc = useQueryClient();
  const base = `/api/v1/orgs/${organizationId}`;
  const keys = useQuery({
    queryKey: ["api-keys", organizationId],
    queryFn: () => api<ApiKeyListResponse>("GET", `${base}/api-keys`),
    initialData: { apiKeys: initialKeys, nextCursor: null },
  });
  const history = useQuery({
    queryKey: ["org-history", organizationId],
    queryFn: () => api<OrganizationHistoryResponse>("GET", `${base}/history`),
    initialData: { events: initialEvents, nextCursor: null },
  });
  const refresh = () =>
    Promise.all([
      qc.invalidateQueries({ queryKey: ["api-keys", organizationId] }),
      qc.invalidateQueries({ queryKey: ["org-history", organizationId] }),
    ]);

  const [created, setCreated] = useState<ApiKeyCreatedResponse | null>(null);
  // The new key appears below the form: bring it into view and move the focus there (on a phone it is off screen).
  const newKey = useRef<HTMLElement>(null);
  useEffect(() => {
    if (!created) return;
    newKey.current?.scrollIntoView({ block: "center" });
    newKey.current?.focus({ preventScroll: true });
  }, [created]);
  const [copied, setCopied] = useState(false);
  const [confirming, setConfirming] = useState<string | null>(null);
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);

  const { register, handleSubmit, formState, reset, setError } = useForm<ApiKeyCreateRequest>({
    resolver: zodResolver(ApiKeyCreateRequest),
    defaultValues: { name: "", scope: "read" },
  });

  const onCreate = handleSubmit(async (v) => {
    setMessage(null);
    try {
      const res = await api<ApiKeyCreatedResponse>("POST", `${base}/api-keys`, v);
      setCreated(res);
      setCopied(false);
      reset({ name: "", scope: v.scope });
      await refresh();
    } catch (e) {
      const err = e instanceof ApiError ? e : new ApiError(0, String(e));
      applyServerErrors(err.errors, ["name", "scope"], setError);
      setMessage({ kind: "error", text: err.message });
    }
  });

  const revoke = useMutation({
    mutationFn: (k: ApiKeyEntry) => api<{ apiKey: ApiKeyEntry }>("DELETE", `${base}/api-keys/${k.id}`),
    onSuccess: (res) => {
      setConfirming(null);
      setMessage({ kind: "ok", text: `“${res.apiKey.name}” is revoked; requests with it are refused from now on.` });
      void refresh();
    },
    onError: (err) => setMessage({ kind: "error", text: err instanceof ApiError ? err.message : "The key could not be revoked." }),
  });

  const copy = async () => {
    if (!created) return;
    try {
      await navigator.clipboard.writeText(created.key);
      setCopied(true);
    } catch {
      setMessage({ kind: "error", text: "The browser did not allow copying; select the key and copy it by hand." });
    }
  };

  return (
    <div className="space-y-6">
      {message && <FormMessage kind={message.kind}>{message.text}</FormMessage>}

      <section className="card space-y-3">
        <h2>Make a key</h2>
        <form method="post" onSubmit={onCreate} className="space-y-3" noValidate>
          <Field label="Name" htmlFor="key-name" error={formState.errors.name} hint="What the key is for, e.g. “Nightly schedule export”.">
            <input id="key-name" type="text" autoComplete="off" {...register("name")} />
          </Field>
          <fieldset>
            <legend className="mb-1 font-bold">Scope</legend>
            <div className="space-y-2">
              {KEY_SCOPES.map((s) => (
                <label key={s} className="flex items-start gap-2 font-normal">
                  <input type="radio" value={s} className="mt-1 w-auto" {...register("scope")} data-testid={`scope-${s}`} />
                  <span>
                    <span className="font-bold">{SCOPE_LABELS[s]}</span>
                    <span className="block text-sm text-slate">{KEY_SCOPE_SUMMARIES[s]}</span>
                  </span>
                </label>
              ))}
            </div>
            {formState.errors.scope?.message && <p className="field-error">{formState.errors.scope.message}</p>}
          </fieldset>
          <button type="submit" className="btn" disabled={!hydrated || formState.isSubmitting}>
            {formState.isSubmitting ? "Making the key…" : "Make key"}
          </button>
        </form>
      </section>

      {created && (
        <section ref={newKey} tabIndex={-1} className="notice space-y-2" data-testid="new-key" aria-live="polite">
          <p className="font-bold">
            The key “{created.apiKey.name}” ({SCOPE_LABELS[created.apiKey.scope]})
          </p>
          <p>Copy it now and keep it somewhere safe: Paneray stores only a fingerprint of it and will not show it again.</p>
          <div className="flex flex-wrap items-center gap-2">
            <code className="min-w-0 max-w-full break-all rounded bg-white px-2 py-1 font-mono text-sm" data-testid="new-key-value">
              {created.key}
            </code>
            <button type="button" className="btn-quiet" onClick={() => void copy()}>
              {copied ? "Copied" : "Copy"}
            </button>
            <button type="button" className="btn-quiet" onClick={() => setCreated(null)}>
              I have saved it
            </button>
          </div>
        </section>
      )}

      <section className="card">
        <h2 className="mb-3">Keys</h2>
        {keys.data.apiKeys.length === 0 ? (
          <p className="text-sm text-slate">No keys yet.</p>
        ) : (
          <ul className="divide-y divide-line text-sm" data-testid="api-keys">
            {keys.data.apiKeys.map((k) => (
              <li key={k.id} className="flex flex-wrap items-center gap-x-4 gap-y-1 py-3" data-testid="api-key-row">
                <div className="min-w-0 flex-1 basis-64">
                  <p>
                    <span className="font-bold">{k.name}</span> <span className="badge">{SCOPE_LABELS[k.scope]}</span>{" "}
                    {k.revokedAt && <span className="badge bg-alert/10 text-alert">Revoked</span>}
                  </p>
                  <p className="text-slate">
                    <code className="font-mono">{k.start}…</code> · made by {k.createdByName}, {when(k.createdAt)}
                  </p>
                  <p className="text-slate">
                    {k.lastUsedAt ? `Last used ${when(k.lastUsedAt)}` : "Never used"}
                    {k.revokedAt && ` · revoked ${when(k.revokedAt)}`}
                  </p>
                </div>
                {!k.revokedAt &&
                  (confirming === k.id ? (
                    <div className="flex flex-wrap items-center gap-2" role="group" aria-label={`Confirm revoking ${k.name}`}>
                      <span>Revoke “{k.name}”? Scripts using it are refused at once.</span>
                      <button type="button" className="btn-danger" disabled={revoke.isPending} onClick={() => revoke.mutate(k)}>
                        Revoke key
                      </button>
                      <button type="button" className="btn-quiet" onClick={() => setConfirming(null)}>
                        Keep it
                      </button>
                    </div>
                  ) : (
                    <button type="button" className="btn-danger" disabled={!hydrated} onClick={() => setConfirming(k.id)}>
                      Revoke…
                    </button>
                  ))}
              </li>
            ))}
          </ul>
        )}
      </section>

      <section className="card">
        <h2 className="mb-3">Organisation history</h2>
        {history.data.events.length === 0 ? (
          <p className="text-sm text-slate">Nothing recorded yet.</p>
        ) : (
          <ol className="divide-y divide-line text-sm" data-testid="org-history">
            {history.data.events.map((e) => (
              <li key={e.id} className="py-2">
                <span>{e.summary}</span>
                <span className="block text-slate">
                  {e.actorName}, {when(e.createdAt)}
                </span>
              </li>
            ))}
          </ol>
        )}
      </section>
    </div>
  );
}

export default withQueryClient(ApiKeysManager);
