import { useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api, ApiError } from "@/lib/client/api";
import { isConflict, withQueryClient } from "@/lib/client/query";
import { useHydrated } from "@/components/forms/useHydrated";
import type { MakeupEntry } from "@/lib/contracts/library";

/** The make-up being edited, when it came from (or went to) the library. */
export interface OpenMakeup {
  id: string;
  revision: number;
  name: string;
}

interface Props {
  organizationId: string;
  organizationName: string;
  canSave: boolean;
  layers: unknown[];
  valid: boolean;
  open: OpenMakeup | null;
  onOpen: (m: MakeupEntry) => void;
  onSaved: (m: MakeupEntry) => void;
}

/** Save the composed make-up to the organisation's library (new, or a new revision of the open one) and open saved ones. */
function LibraryBar({ organizationId, organizationName, canSave, layers, valid, open, onOpen, onSaved }: Props) {
  const qc = useQueryClient();
  const hydrated = useHydrated();
  const list = useQuery({
    queryKey: ["makeups", organizationId],
    queryFn: () => api<{ items: MakeupEntry[] }>("GET", `/api/v1/orgs/${organizationId}/makeups?limit=100`),
  });
  const [name, setName] = useState(open?.name ?? "");
  const [note, setNote] = useState("");
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string; conflict?: boolean } | null>(null);
  const done = (m: MakeupEntry, text: string) => {
    setMessage({ kind: "ok", text });
    void qc.invalidateQueries({ queryKey: ["makeups", organizationId] });
    onSaved(m);
  };
  const fail = (err: unknown) =>
    setMessage({ kind: "error", text: err instanceof ApiError ? err.message : "The make-up could not be saved.", conflict: isConflict(err) });
  const saveNew = useMutation({
    mutationFn: () =>
      api<MakeupEntry>("POST", `/api/v1/orgs/${organizationId}/makeups`, { name: name.trim(), layers, note: note.trim() || undefined }),
    onSuccess: (m) => done(m, `Saved “${m.name}” to the library (revision 1): ${m.description}.`),
    onError: fail,
  });
  const saveRevision = useMutation({
    mutationFn: () =>
      api<MakeupEntry>("PATCH", `/api/v1/makeups/${open!.id}`, {
        revision: open!.revision,
        name: name.trim() || open!.name,
        layers,
        ...(note.trim() ? { note: note.trim() } : {}),
      }),
    onSuccess: (m) => done(m, `Saved revision ${m.revision} of “${m.name}”: ${m.description}.`),
    onError: fail,
  });
  const reloadOpen = async () => {
    if (!open) return;
    const m = await api<MakeupEntry>("GET", `/api/v1/makeups/${open.id}`);
    setMessage(null);
    onOpen(m);
  };
  const busy = saveNew.isPending || saveRevision.isPending;
  const nameMissing = !name.trim() && !open;

  return (
    <section className="card space-y-3" aria-labelledby="library-bar-title">
      <div className="flex flex-wrap items-baseline gap-x-3">
        <h2 id="library-bar-title" className="text-base">
          Library of {organizationName}
        </h2>
        {open ? (
          <span className="text-sm" data-testid="open-makeup">
            Editing <strong>{open.name}</strong>, revision {open.revision}
          </span>
        ) : (
          <span className="text-sm text-slate">Not saved in the library yet</span>
        )}
        <a className="ml-auto text-sm" href="/library">
          Browse the library
        </a>
      </div>
      <div className="flex flex-wrap items-end gap-2">
        <label className="flex min-w-[14rem] flex-1 flex-col text-sm" htmlFor="library-open">
          <span className="font-bold text-slate">Open from the library</span>
          <select
            id="library-open"
            value=""
            disabled={!list.data}
            onChange={async (e) => {
              if (!e.target.value) return;
              const m = await api<MakeupEntry>("GET", `/api/v1/makeups/${e.target.value}`);
              setName(m.name);
              setNote("");
              setMessage(null);
              onOpen(m);
            }}
          >
            <option value="">{list.isPending ? "Loading…" : list.data?.items.length ? "Choose a saved make-up…" : "The library is empty"}</option>
            {list.data?.items.map((m) => (
              <option key={m.id} value={m.id}>
                {m.name} — {m.description}
              </option>
            ))}
          </select>
        </label>
      </div>
      {canSave && (
        <form
          className="flex flex-wrap items-end gap-2 border-t border-line pt-3"
          noValidate
          onSubmit={(e) => {
            e.preventDefault();
            if (!valid) return setMessage({ kind: "error", text: "Correct the make-up first: the highlighted fields need a valid value." });
            if (nameMissing) return setMessage({ kind: "error", text: "Name: give the make-up a name before saving it." });
            saveNew.mutate();
          }}
        >
          <label className="flex min-w-[12rem] flex-1 flex-col text-sm" htmlFor="library-name">
            <span className="font-bold text-slate">Name</span>
            <input id="library-name" value={name} maxLength={120} onChange={(e) => setName(e.target.value)} />
          </label>
          <label className="flex min-w-[12rem] flex-1 flex-col text-sm" htmlFor="library-note">
            <span className="font-bold text-slate">Note (e.g. data-sheet reference)</span>
            <input id="library-note" value={note} maxLength={2000} onChange={(e) => setNote(e.target.value)} />
          </label>
          {open && (
            <button
              type="button"
              className="btn"
              disabled={busy}
              onClick={() => (valid ? saveRevision.mutate() : setMessage({ kind: "error", text: "Correct the make-up first." }))}
            >
              Save as revision {open.revision + 1}
            </button>
          )}
          <button type="submit" className={open ? "btn-quiet" : "btn"} disabled={!hydrated || busy}>
            {open ? "Save as a new make-up" : "Save to library"}
          </button>
        </form>
      )}
      {message && (
        <p className={`text-sm ${message.kind === "error" ? "text-alert" : "text-glass"}`} role={message.kind === "error" ? "alert" : "status"}>
          {message.text}{" "}
          {message.conflict && (
            <button type="button" className="underline" onClick={() => void reloadOpen()}>
              Reload the saved make-up
            </button>
          )}
        </p>
      )}
    </section>
  );
}

export default withQueryClient(LibraryBar);
