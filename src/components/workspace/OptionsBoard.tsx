import { useState } from "react";
import { useInfiniteQuery, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api, ApiError } from "@/lib/client/api";
import { isConflict, withQueryClient } from "@/lib/client/query";
import type { MakeupEntry } from "@/lib/contracts/library";
import type { OptionEntry } from "@/lib/contracts/options";
import { FormMessage } from "@/components/forms/Field";
import RequirementsEditor from "./RequirementsEditor";
import MakeupSection from "@/components/glazing/MakeupSection";
import ChangeMakeup, { type Library, type Repointed } from "./ChangeMakeup";
import { lightText, makeupLight } from "@/lib/calc/makeup-light";

interface FacadeRef {
  id: string;
  name: string;
  azimuthDeg: number;
  tiltDeg: number;
}

interface Props {
  projectId: string;
  organizationId: string;
  facades: FacadeRef[];
  /** Owners and consultants add, re-point and remove options and set the requirements. */
  canAssign: boolean;
}

const fixed = (v: number | null | undefined, d = 2) => (v === null || v === undefined ? "—" : v.toFixed(d));
const STATUS_LABEL = { proposed: "Under review", approved: "Approved", rejected: "Rejected" } as const;
const STATUS_STYLE = {
  proposed: "border-line bg-paper text-slate",
  approved: "border-glass/40 bg-glass-light text-glass",
  rejected: "border-alert/50 bg-white text-alert",
} as const;

function problemText(err: unknown): string {
  return err instanceof ApiError ? err.message : "Something went wrong; nothing was changed.";
}

/** The project's façades, each with its candidate make-ups from the library, and the brief's requirements. */
function OptionsBoard({ projectId, organizationId, facades, canAssign }: Props) {
  const qc = useQueryClient();
  const options = useQuery({
    queryKey: ["options", projectId],
    queryFn: () => api<{ options: OptionEntry[] }>("GET", `/api/v1/projects/${projectId}/options`),
  });
  // The organisation's library, a page of 100 make-ups at a time (by name); more pages on request.
  const pages = useInfiniteQuery({
    queryKey: ["makeups", organizationId],
    initialPageParam: null as string | null,
    queryFn: ({ pageParam }) =>
      api<{ items: MakeupEntry[]; nextCursor: string | null }>(
        "GET",
        `/api/v1/orgs/${organizationId}/makeups?limit=100${pageParam ? `&cursor=${encodeURIComponent(pageParam)}` : ""}`,
      ),
    getNextPageParam: (last) => last.nextCursor,
    enabled: canAssign,
  });
  const library: Library = {
    items: pages.data?.pages.flatMap((p) => p.items),
    isError: pages.isError,
    hasMore: pages.hasNextPage,
    loadingMore: pages.isFetchingNextPage,
    loadMore: () => void pages.fetchNextPage(),
  };
  const [failure, setFailure] = useState<{ text: string; conflict: boolean } | null>(null);
  /** The option whose make-up is being changed, and the last change made (shown in its façade's card). */
  const [choosing, setChoosing] = useState<string | null>(null);
  const [notice, setNotice] = useState<{ facadeId: string; text: string } | null>(null);
  /** An action waiting for the consultant's yes in the façade's card: removing an option, or moving an approved one to its newest revision. */
  const [asking, setAsking] = useState<{ option: OptionEntry; action: "remove" | "newest" } | null>(null);
  const onError = (err: unknown) => setFailure({ text: problemText(err), conflict: isConflict(err) });
  const focusLater = (id: string) => requestAnimationFrame(() => document.getElementById(id)?.focus());
  const closeChooser = (optionId: string) => {
    setChoosing(null);
    focusLater(`change-open-${optionId}`);
  };
  const repointed = ({ option, approvalWithdrawn }: Repointed) => {
    setNotice({
      facadeId: option.facadeId,
      text: `“${option.name}” now uses ${option.makeupName}, revision ${option.makeupRevision}.${approvalWithdrawn ? " Its approval was withdrawn: it is under review again." : ""}`,
    });
    closeChooser(option.id);
  };
  const refresh = () => {
    setFailure(null);
    setNotice(null);
    void qc.invalidateQueries({ queryKey: ["options", projectId] });
    void qc.invalidateQueries({ queryKey: ["results", projectId] });
  };
  const repoint = useMutation({
    mutationFn: (o: OptionEntry) => api("PATCH", `/api/v1/options/${o.id}`, { version: o.version, makeupRevision: "latest" }),
    onSuccess: refresh,
    onError,
  });
  const remove = useMutation({
    mutationFn: (o: OptionEntry) => api("DELETE", `/api/v1/options/${o.id}`),
    onSuccess: refresh,
    onError,
  });

  if (options.isPending) return <p className="text-sm text-slate">Loading the options…</p>;
  if (options.isError)
    return (
      <FormMessage kind="error">
        The options could not be loaded: {problemText(options.error)}{" "}
        <button type="button" className="underline" onClick={() => void options.refetch()}>
          Try again
        </button>
      </FormMessage>
    );
  const all = options.data.options;

  return (
    <div className="space-y-6">
      {failure && (
        <FormMessage kind="error">
          {failure.text}{" "}
          {failure.conflict && (
            <button type="button" className="underline" onClick={refresh}>
              Reload the options
            </button>
          )}
        </FormMessage>
      )}
      {facades.length === 0 && (
        <p className="text-sm text-slate">This project has no façades yet; add them under Edit project, then give each its options.</p>
      )}
      <ol className="space-y-4" aria-label="Façades and their options">
        {facades.map((f, i) => {
          const mine = all.filter((o) => o.facadeId === f.id);
          const chooserFor = mine.find((o) => o.id === choosing);
          return (
            <li key={f.id} className="card space-y-3" data-testid="facade-options" data-facade={f.name}>
              <div className="flex flex-wrap items-baseline gap-x-3">
                <h3 className="text-base font-bold">
                  <span className="text-slate">{i + 1}.</span> {f.name}
                </h3>
                <span className="text-sm text-slate tabular-nums">
                  faces {f.azimuthDeg}° · tilt {f.tiltDeg}°
                </span>
              </div>
              {notice?.facadeId === f.id && <FormMessage kind="ok">{notice.text}</FormMessage>}
              {mine.length === 0 ? (
                <p className="text-sm text-slate">No options yet{canAssign ? ": add one from the library below." : "."}</p>
              ) : (
                <div className="relative overflow-x-auto">
                  <table className="w-full min-w-[36rem] text-sm" data-testid="options-table">
                    <thead className="text-left text-slate">
                      <tr>
                        <th className="py-1 pr-3">Option</th>
                        <th className="pr-3">Make-up</th>
                        <th className="pr-3 text-right">τe</th>
                        <th className="pr-3 text-right">g</th>
                        <th className="pr-3 text-right">U W/m²K</th>
                        <th className="pr-3 text-right">τv</th>
                        <th className="pr-3">Status</th>
                        {canAssign && <th className="sr-only">Actions</th>}
                      </tr>
                    </thead>
                    <tbody>
                      {mine.map((o) => {
                        const changed = o.latestMakeupRevision > o.makeupRevision;
                        return (
                          <tr key={o.id} className="border-t border-line align-top" data-option={o.name}>
                            <td className="py-1.5 pr-3 font-bold">{o.name}</td>
                            <td className="pr-3">
                              <MakeupSection layers={o.layers} height={34} labels={false} title={`${o.makeupName} in section`} />
                              <div>{o.makeupName}</div>
                              <div className="font-mono text-xs text-slate">
                                {o.description} · rev. {o.makeupRevision}
                              </div>
                              {changed && (
                                <div className="mt-1 text-xs text-alert">
                                  The library holds revision {o.latestMakeupRevision} now.{" "}
                                  {canAssign && (
                                    <button
                                      type="button"
                                      className="underline"
                                      disabled={repoint.isPending}
                                      onClick={() => (o.status === "approved" ? setAsking({ option: o, action: "newest" }) : repoint.mutate(o))}
                                    >
                                      Use revision {o.latestMakeupRevision}
                                      {o.status === "approved" ? " (withdraws the approval)" : ""}
                                    </button>
                                  )}
                                </div>
                              )}
                              {canAssign && (
                                <button
                                  type="button"
                                  id={`change-open-${o.id}`}
                                  className="mt-1 text-xs underline"
                                  aria-expanded={choosing === o.id}
                                  aria-controls={choosing === o.id ? `change-${o.id}` : undefined}
                                  onClick={() => {
                                    setNotice(null);
                                    setChoosing(choosing === o.id ? null : o.id);
                                  }}
                                >
                                  Choose another make-up<span className="sr-only"> for {o.name}</span>
                                </button>
                              )}
                            </td>
                            <td className="pr-3 text-right tabular-nums" data-value="solarTransmittance">
                              {fixed(o.values.normal.solarTransmittance)}
                            </td>
                            <td className="pr-3 text-right tabular-nums" data-value="gValue">
                              {fixed(o.values.normal.gValue)}
                            </td>
                            <td className="pr-3 text-right tabular-nums" data-value="uValue">
                              {fixed(o.values.uValue)}
                            </td>
                            <td className="pr-3 text-right tabular-nums" data-value="visibleTransmittance">
                              {lightText(makeupLight(o.values))}
                            </td>
                            <td className="pr-3">
                              <span className={`rounded border px-1.5 py-0.5 text-xs ${STATUS_STYLE[o.status]}`}>{STATUS_LABEL[o.status]}</span>
                            </td>
                            {canAssign && (
                              <td className="text-right">
                                <button
                                  type="button"
                                  className="btn-quiet text-xs"
                                  disabled={remove.isPending}
                                  onClick={() => setAsking({ option: o, action: "remove" })}
                                >
                                  Remove<span className="sr-only"> {o.name}</span>
                                </button>
                              </td>
                            )}
                          </tr>
                        );
                      })}
                    </tbody>
                  </table>
                </div>
              )}
              {canAssign && asking && asking.option.facadeId === f.id && (
                <div className="notice space-y-2" role="alertdialog" aria-labelledby={`ask-${asking.option.id}`} data-testid="option-confirm">
                  <p id={`ask-${asking.option.id}`}>
                    {asking.action === "remove"
                      ? `Remove the option “${asking.option.name}” from ${f.name}? Its comments and decisions go with it${asking.option.status === "approved" ? "; it is the approved option of this façade, so the façade will have none" : ""}. Issued revisions keep their copy.`
                      : `Move “${asking.option.name}” to revision ${asking.option.latestMakeupRevision} of its make-up? Its approval is withdrawn: the architect reviews it again.`}
                  </p>
                  <div className="flex flex-wrap gap-2">
                    <button
                      type="button"
                      className={asking.action === "remove" ? "btn-danger" : "btn"}
                      autoFocus
                      disabled={remove.isPending || repoint.isPending}
                      onClick={() => {
                        const { option, action } = asking;
                        setAsking(null);
                        if (action === "remove") remove.mutate(option);
                        else repoint.mutate(option);
                      }}
                    >
                      {asking.action === "remove" ? "Remove the option" : "Withdraw the approval and move"}
                    </button>
                    <button type="button" className="btn-quiet" onClick={() => setAsking(null)}>
                      Keep it as it is
                    </button>
                  </div>
                </div>
              )}
              {canAssign && chooserFor && (
                <div id={`change-${chooserFor.id}`}>
                  <ChangeMakeup
                    key={chooserFor.id}
                    projectId={projectId}
                    option={chooserFor}
                    facadeName={f.name}
                    library={library}
                    onDone={repointed}
                    onCancel={() => closeChooser(chooserFor.id)}
                    onReload={refresh}
                  />
                </div>
              )}
              {canAssign && <AddOption projectId={projectId} facade={f} library={library} onAdded={refresh} />}
            </li>
          );
        })}
      </ol>
      <RequirementsEditor projectId={projectId} facades={facades} canEdit={canAssign} />
    </div>
  );
}

function AddOption(props: { projectId: string; facade: FacadeRef; library: Library; onAdded: () => void }) {
  const { projectId, facade } = props;
  const library = props.library.items;
  const [makeupId, setMakeupId] = useState("");
  const [name, setName] = useState("");
  const [error, setError] = useState<string | null>(null);
  const add = useMutation({
    mutationFn: () => api("POST", `/api/v1/projects/${projectId}/options`, { facadeId: facade.id, makeupId, name: name.trim() }),
    onSuccess: () => {
      setName("");
      setMakeupId("");
      setError(null);
      props.onAdded();
    },
    onError: (err) => setError(problemText(err)),
  });
  if (props.library.isError) return <p className="text-sm text-alert">The library could not be loaded.</p>;
  if (!library) return <p className="text-sm text-slate">Loading the library…</p>;
  if (library.length === 0)
    return (
      <p className="text-sm text-slate">
        The library has no make-ups yet. <a href="/glazing">Compose one and save it to the library.</a>
      </p>
    );
  const idBase = `add-${facade.id}`;
  return (
    <form
      className="flex flex-wrap items-end gap-2 border-t border-line pt-3"
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        if (!makeupId) return setError("Choose a make-up from the library.");
        if (!name.trim()) return setError(`${facade.name}: the option needs a name.`);
        add.mutate();
      }}
    >
      <label className="flex min-w-[14rem] flex-1 flex-col text-sm" htmlFor={`${idBase}-makeup`}>
        <span className="font-bold text-slate">Make-up from the library</span>
        <select
          id={`${idBase}-makeup`}
          value={makeupId}
          onChange={(e) => {
            setMakeupId(e.target.value);
            const m = library.find((x) => x.id === e.target.value);
            if (m && !name) setName(m.name);
          }}
        >
          <option value="">Choose…</option>
          {library.map((m) => (
            <option key={m.id} value={m.id}>
              {m.name} — {m.description}
            </option>
          ))}
        </select>
      </label>
      <label className="flex min-w-[10rem] flex-col text-sm" htmlFor={`${idBase}-name`}>
        <span className="font-bold text-slate">Option name</span>
        <input id={`${idBase}-name`} value={name} maxLength={120} onChange={(e) => setName(e.target.value)} />
      </label>
      {props.library.hasMore && (
        <button type="button" className="btn-quiet text-sm" disabled={props.library.loadingMore} onClick={props.library.loadMore}>
          {props.library.loadingMore ? "Loading more…" : "More make-ups from the library"}
        </button>
      )}
      <button type="submit" className="btn" disabled={add.isPending}>
        {add.isPending ? "Adding…" : "Add option"}
      </button>
      {error && (
        <p className="w-full text-sm text-alert" role="alert">
          {error}
        </p>
      )}
    </form>
  );
}

export default withQueryClient(OptionsBoard);
