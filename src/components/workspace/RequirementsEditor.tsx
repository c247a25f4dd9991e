import { useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api, ApiError } from "@/lib/client/api";
import { isConflict } from "@/lib/client/query";
import { Limits, REQUIREMENT_KEYS, REQUIREMENT_LABELS, RequirementsRequest, type RequirementKey } from "@/lib/contracts/requirements";
import { FormMessage } from "@/components/forms/Field";

interface Entry {
  project: Limits;
  facades: Record<string, Limits>;
  version: number;
}

type Draft = Record<string, Partial<Record<RequirementKey, string>>>;
const PROJECT = "project";

const toDraft = (l: Limits): Partial<Record<RequirementKey, string>> =>
  Object.fromEntries(REQUIREMENT_KEYS.filter((k) => l[k] !== undefined).map((k) => [k, String(l[k])]));

/** Texts of one row as Limits (empty cells left out); the schema of the endpoint decides what is valid. */
const toLimits = (row: Partial<Record<RequirementKey, string>> = {}) =>
  Object.fromEntries(
    REQUIREMENT_KEYS.filter((k) => (row[k] ?? "").trim() !== "").map((k) => [k, Number((row[k] ?? "").trim().replace(",", "."))]),
  ) as Limits;

const draftOf = (entry: Entry): Draft => ({
  [PROJECT]: toDraft(entry.project),
  ...Object.fromEntries(Object.entries(entry.facades).map(([id, l]) => [id, toDraft(l)])),
});

/** The brief's limits: one row for the project and an optional row of overrides per façade. */
export default function RequirementsEditor(props: { projectId: string; facades: { id: string; name: string }[]; canEdit: boolean }) {
  const q = useQuery({
    queryKey: ["requirements", props.projectId],
    queryFn: () => api<Entry>("GET", `/api/v1/projects/${props.projectId}/requirements`),
  });
  if (q.isPending) return <p className="text-sm text-slate">Loading the requirements…</p>;
  if (q.isError) return <FormMessage kind="error">The requirements could not be loaded.</FormMessage>;
  // One form for the page's life: a new version from the server resets its fields (RequirementsForm), so the
  // confirmation of a save and the keyboard focus survive the save.
  return <RequirementsForm {...props} entry={q.data} reload={() => void q.refetch()} />;
}

function RequirementsForm(props: { projectId: string; facades: { id: string; name: string }[]; canEdit: boolean; entry: Entry; reload: () => void }) {
  const { projectId, facades, canEdit, entry } = props;
  const qc = useQueryClient();
  const [draft, setDraft] = useState<Draft>(() => draftOf(entry));
  const [errors, setErrors] = useState<string[]>([]);
  const [saved, setSaved] = useState(false);
  // A new version read from the server (this form's save, or a reload after a stale save) starts the fields
  // afresh from it; the messages of the save stay as the save left them.
  const [shownVersion, setShownVersion] = useState(entry.version);
  if (entry.version !== shownVersion) {
    setShownVersion(entry.version);
    setDraft(draftOf(entry));
  }
  const save = useMutation({
    mutationFn: (body: unknown) => api<Entry>("PUT", `/api/v1/projects/${projectId}/requirements`, body),
    onSuccess: (data) => {
      qc.setQueryData(["requirements", projectId], data);
      void qc.invalidateQueries({ queryKey: ["results", projectId] });
      setErrors([]);
      setSaved(true);
    },
    onError: (err) => {
      setSaved(false);
      setErrors([err instanceof ApiError ? err.message : "The requirements could not be saved."]);
    },
  });
  const rows = [{ id: PROJECT, name: "Whole project" }, ...facades];
  const set = (row: string, k: RequirementKey, v: string) => {
    setSaved(false);
    setDraft((d) => ({ ...d, [row]: { ...d[row], [k]: v } }));
  };
  const submit = () => {
    const messages: string[] = [];
    const body = { project: toLimits(draft[PROJECT]), facades: {} as Record<string, Limits>, version: entry.version };
    for (const r of rows) {
      const limits = toLimits(draft[r.id]);
      const check = Limits.safeParse(limits);
      if (!check.success)
        for (const issue of check.error.issues) {
          const key = issue.path[0] as RequirementKey;
          messages.push(`${r.name}: ${REQUIREMENT_LABELS[key] ?? key} — ${issue.message.replace(key, "the value")}`);
        }
      if (r.id !== PROJECT && Object.keys(limits).length) body.facades[r.id] = limits;
    }
    if (!RequirementsRequest.safeParse(body).success && messages.length === 0) messages.push("Every limit must be a number.");
    if (messages.length) return setErrors(messages);
    save.mutate(body);
  };

  return (
    <section className="card space-y-3" aria-labelledby="requirements-title">
      <h2 id="requirements-title">Requirements of the brief</h2>
      <p className="text-sm text-slate">
        The limits the options are checked against, entered from the brief or the code you follow; a façade’s value replaces the project’s. Paneray
        ships no code values: local codes and the design team decide which apply.
      </p>
      {errors.length > 0 && (
        <FormMessage kind="error">
          <ul>
            {errors.map((e) => (
              <li key={e}>{e}</li>
            ))}
          </ul>
          {save.error && isConflict(save.error) && (
            <button
              type="button"
              className="underline"
              onClick={() => {
                setErrors([]);
                save.reset();
                props.reload();
              }}
            >
              Reload the requirements
            </button>
          )}
        </FormMessage>
      )}
      {saved && <FormMessage kind="ok">Requirements saved; the results are checked against them.</FormMessage>}
      <div className="relative overflow-x-auto">
        <table className="w-full min-w-[44rem] text-sm" data-testid="requirements-table">
          <thead className="text-left text-slate">
            <tr>
              <th className="py-1 pr-3">Applies to</th>
              {REQUIREMENT_KEYS.map((k) => (
                <th key={k} className="pr-3 font-bold">
                  {REQUIREMENT_LABELS[k]}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.id} className="border-t border-line">
                <td className="py-1.5 pr-3 font-bold">{r.name}</td>
                {REQUIREMENT_KEYS.map((k) => (
                  <td key={k} className="pr-3">
                    <input
                      aria-label={`${r.name}: ${REQUIREMENT_LABELS[k]}`}
                      className="w-24"
                      inputMode="decimal"
                      disabled={!canEdit}
                      placeholder={r.id === PROJECT ? "none" : "as project"}
                      value={draft[r.id]?.[k] ?? ""}
                      onChange={(e) => set(r.id, k, e.target.value)}
                    />
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {canEdit && (
        <button type="button" className="btn" disabled={save.isPending} onClick={submit}>
          {save.isPending ? "Saving…" : "Save the requirements"}
        </button>
      )}
    </section>
  );
}
