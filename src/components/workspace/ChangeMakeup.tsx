import { useEffect, useRef, useState } from "react";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api, ApiError } from "@/lib/client/api";
import { isConflict } from "@/lib/client/query";
import type { MakeupEntry } from "@/lib/contracts/library";
import { OptionPatchRequest, type OptionEntry } from "@/lib/contracts/options";
import MakeupSection from "@/components/glazing/MakeupSection";
import { lightText, makeupLight } from "@/lib/calc/makeup-light";

export interface Library {
  items: MakeupEntry[] | undefined;
  isError: boolean;
  hasMore: boolean;
  loadingMore: boolean;
  loadMore: () => void;
}

export interface Repointed {
  option: OptionEntry;
  approvalWithdrawn: boolean;
}

/** Words for the fields of OptionPatchRequest, so that a refusal never shows a raw key. */
const FIELD_WORDS: Record<string, string> = { makeupId: "Make-up", version: "Version of the option", name: "Option name", position: "Position" };

/** The first problem of a patch body as a sentence naming the field in words; null when the body is valid. */
export function patchProblem(body: unknown): string | null {
  const check = OptionPatchRequest.safeParse(body);
  if (check.success) return null;
  const issue = check.error.issues[0]!;
  const key = String(issue.path[0] ?? "");
  const words = FIELD_WORDS[key];
  return words ? `${words}: ${issue.message.replace(key, "it")}` : issue.message;
}

const fixed = (v: number | null | undefined, d = 2) => (v === null || v === undefined ? "—" : v.toFixed(d));

/**
 * Points one option at another make-up of the organisation's library (its current revision). An approved
 * option asks first, in the page, because the server withdraws the approval when the make-up changes.
 */
export default function ChangeMakeup(props: {
  projectId: string;
  option: OptionEntry;
  facadeName: string;
  library: Library;
  onDone: (result: Repointed) => void;
  onCancel: () => void;
  onReload: () => void;
}) {
  const { option, library, projectId } = props;
  const qc = useQueryClient();
  const [makeupId, setMakeupId] = useState("");
  const [confirming, setConfirming] = useState(false);
  const [failure, setFailure] = useState<{ text: string; conflict: boolean } | null>(null);
  const selectRef = useRef<HTMLSelectElement>(null);
  const confirmRef = useRef<HTMLButtonElement>(null);
  const idBase = `change-${option.id}`;

  const submitRef = useRef<HTMLButtonElement>(null);
  useEffect(() => {
    selectRef.current?.focus();
  }, []);
  useEffect(() => {
    if (confirming) confirmRef.current?.focus();
  }, [confirming]);

  const change = useMutation({
    mutationFn: (body: { version: number; makeupId: string }) => api<Repointed>("PATCH", `/api/v1/options/${option.id}`, body),
    onSuccess: (result) => {
      qc.setQueryData<{ options: OptionEntry[] }>(["options", projectId], (old) =>
        old ? { options: old.options.map((o) => (o.id === result.option.id ? result.option : o)) } : old,
      );
      void qc.invalidateQueries({ queryKey: ["options", projectId] });
      void qc.invalidateQueries({ queryKey: ["results", projectId] });
      props.onDone(result);
    },
    onError: (err) => {
      setConfirming(false);
      setFailure({
        text: err instanceof ApiError ? err.message : "Something went wrong; the option was not changed.",
        conflict: isConflict(err),
      });
    },
  });

  const choices = (library.items ?? []).filter((m) => m.id !== option.makeupId);
  const chosen = choices.find((m) => m.id === makeupId);
  const approved = option.status === "approved";

  const submit = () => {
    setFailure(null);
    if (!makeupId) return setFailure({ text: "Make-up: choose one from the library.", conflict: false });
    const body = { version: option.version, makeupId };
    const problem = patchProblem(body);
    if (problem) return setFailure({ text: problem, conflict: false });
    if (approved && !confirming) return setConfirming(true);
    change.mutate(body);
  };

  return (
    <form
      className="space-y-3 rounded border border-line bg-paper p-3"
      aria-labelledby={`${idBase}-title`}
      data-testid="change-makeup"
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
      onKeyDown={(e) => {
        if (e.key === "Escape" && !change.isPending) {
          e.preventDefault();
          props.onCancel();
        }
      }}
    >
      <h4 id={`${idBase}-title`} className="text-sm font-bold">
        Another make-up for “{option.name}” ({props.facadeName})
      </h4>
      <p className="text-sm text-slate">
        Now: {option.makeupName}, revision {option.makeupRevision}. The option will point at the current revision of the make-up you choose.
      </p>
      {library.isError ? (
        <p className="text-sm text-alert" role="alert">
          The library could not be loaded.
        </p>
      ) : !library.items ? (
        <p className="text-sm text-slate">Loading the library…</p>
      ) : choices.length === 0 && !library.hasMore ? (
        <p className="text-sm text-slate">
          The library holds no other make-up. <a href="/glazing">Compose one and save it to the library.</a>
        </p>
      ) : (
        <div className="flex flex-wrap items-end gap-2">
          <label className="flex min-w-0 flex-1 basis-56 flex-col text-sm" htmlFor={`${idBase}-makeup`}>
            <span className="font-bold text-slate">Replacement make-up</span>
            <select
              id={`${idBase}-makeup`}
              ref={selectRef}
              className="w-full min-w-0"
              value={makeupId}
              disabled={change.isPending}
              onChange={(e) => {
                setMakeupId(e.target.value);
                setConfirming(false);
                setFailure(null);
              }}
            >
              <option value="">Choose…</option>
              {choices.map((m) => (
                <option key={m.id} value={m.id}>
                  {m.name} — {m.description}
                </option>
              ))}
            </select>
          </label>
          {library.hasMore && (
            <button type="button" className="btn-quiet text-sm" disabled={library.loadingMore} onClick={library.loadMore}>
              {library.loadingMore ? "Loading more…" : "More make-ups from the library"}
            </button>
          )}
        </div>
      )}
      {chosen && (
        <div className="text-sm" data-testid="change-makeup-preview">
          <MakeupSection layers={chosen.layers} height={34} labels={false} title={`${chosen.name} in section`} />
          <div className="font-mono text-xs break-words text-slate">
            {chosen.description} · rev. {chosen.revision}
          </div>
          <div className="tabular-nums text-slate">
            τe {fixed(chosen.values.normal.solarTransmittance)} · g {fixed(chosen.values.normal.gValue)} · U {fixed(chosen.values.uValue)} W/m²K · τv{" "}
            {lightText(makeupLight(chosen.values))}
          </div>
        </div>
      )}
      {approved && !confirming && <p className="text-xs text-slate">This option is approved; changing its make-up withdraws the approval.</p>}
      {confirming && chosen && (
        <div className="space-y-2 rounded border border-alert/40 bg-white p-2 text-sm" role="alertdialog" aria-labelledby={`${idBase}-confirm`}>
          <p id={`${idBase}-confirm`} className="text-alert">
            “{option.name}” is the approved option of {props.facadeName}. Pointing it at {chosen.name} withdraws the approval: it goes back to under
            review and needs a new decision.
          </p>
          <div className="flex flex-wrap gap-2">
            <button type="submit" ref={confirmRef} className="btn" disabled={change.isPending}>
              {change.isPending ? "Changing…" : "Withdraw the approval and change"}
            </button>
            <button
              type="button"
              className="btn-quiet"
              disabled={change.isPending}
              onClick={() => {
                setConfirming(false);
                requestAnimationFrame(() => submitRef.current?.focus());
              }}
            >
              Keep the approval
            </button>
          </div>
        </div>
      )}
      {failure && (
        <div className="text-sm text-alert" role="alert">
          {failure.text}{" "}
          {failure.conflict && (
            <button
              type="button"
              className="underline"
              onClick={() => {
                setFailure(null);
                props.onReload();
              }}
            >
              Reload the options
            </button>
          )}
        </div>
      )}
      {!confirming && (
        <div className="flex flex-wrap gap-2">
          <button type="submit" ref={submitRef} className="btn" disabled={change.isPending || !library.items}>
            {change.isPending ? "Changing…" : "Change the make-up"}
          </button>
          <button type="button" className="btn-quiet" disabled={change.isPending} onClick={props.onCancel}>
            Cancel
          </button>
        </div>
      )}
    </form>
  );
}
