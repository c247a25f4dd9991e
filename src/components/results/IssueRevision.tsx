import { useRef, useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import { RevisionIssueRequest } from "@/lib/contracts/revisions";
import type { ResultsResponse, RevisionResponse } from "@/lib/contracts/results";
import { api, ApiError } from "@/lib/client/api";
import { isConflict } from "@/lib/client/query";
import { applyServerErrors, Field, FormMessage } from "@/components/forms/Field";

type Input = z.input<typeof RevisionIssueRequest>;
type Output = z.output<typeof RevisionIssueRequest>;

/** The issue button and its dialog: what will be issued, an optional note, and the answer (letter or refusal). */
export default function IssueRevision({ projectId, results }: { projectId: string; results: ResultsResponse }) {
  const dialog = useRef<HTMLDialogElement>(null);
  const queryClient = useQueryClient();
  const [issued, setIssued] = useState<RevisionResponse | null>(null);
  const { register, handleSubmit, formState, setError, reset } = useForm<Input, unknown, Output>({
    resolver: zodResolver(RevisionIssueRequest),
    defaultValues: { note: "" },
  });
  const issue = useMutation({
    mutationFn: (body: Output) => api<RevisionResponse>("POST", `/api/v1/projects/${projectId}/revisions`, { ...body, year: results.year }),
    onSuccess: (r) => {
      setIssued(r);
      reset({ note: "" });
      void queryClient.invalidateQueries({ queryKey: ["revisions", projectId] });
    },
    onError: (err) => {
      if (err instanceof ApiError) applyServerErrors(err.errors, ["note"], setError);
    },
  });
  const approved = results.facades.flatMap((f) => f.options.filter((o) => o.status === "approved").map((o) => ({ facade: f.name, option: o.name })));
  const without = results.facades.filter((f) => !f.options.some((o) => o.status === "approved")).map((f) => f.name);
  const open = () => {
    setIssued(null);
    issue.reset();
    dialog.current?.showModal();
  };

  return (
    <>
      <button type="button" className="btn" onClick={open} data-testid="issue-open">
        Issue schedule revision
      </button>
      <dialog
        ref={dialog}
        className="m-auto w-[min(36rem,calc(100vw-2rem))] rounded-lg border border-line p-0 backdrop:bg-ink/40"
        aria-labelledby="issue-title"
      >
        <div className="space-y-4 p-5">
          <h2 id="issue-title">Issue a schedule revision</h2>
          {issued ? (
            <>
              <FormMessage kind="ok">
                Revision {issued.revision} issued by {issued.issuedBy} with {issued.facades.length} façade{issued.facades.length === 1 ? "" : "s"}.
                {issued.unapproved &&
                  issued.unapproved.length > 0 &&
                  ` Left out (no approved option): ${issued.unapproved.map((u) => u.name).join(", ")}.`}
              </FormMessage>
              <div className="flex flex-wrap gap-2">
                <a className="btn" href={`/projects/${projectId}/revisions/${issued.revision}`}>
                  Open revision {issued.revision}
                </a>
                <button type="button" className="btn-quiet" onClick={() => dialog.current?.close()}>
                  Close
                </button>
              </div>
            </>
          ) : (
            <form className="space-y-4" onSubmit={handleSubmit((v) => issue.mutate(v))} noValidate>
              <p className="text-sm text-slate">
                A revision freezes every approved option with its make-up, values and {results.year} results. Later edits of the library or the
                options change no issued revision.
              </p>
              {approved.length === 0 ? (
                <FormMessage kind="error">No façade has an approved option yet; an architect or owner approves one per façade first.</FormMessage>
              ) : (
                <ul className="list-disc pl-5 text-sm">
                  {approved.map((a) => (
                    <li key={`${a.facade}-${a.option}`}>
                      {a.facade}: {a.option}
                    </li>
                  ))}
                </ul>
              )}
              {without.length > 0 && approved.length > 0 && (
                <p className="notice">Without an approved option, left out of this revision: {without.join(", ")}.</p>
              )}
              <Field label="Note (optional)" htmlFor="issue-note" error={formState.errors.note}>
                <textarea id="issue-note" rows={3} className="w-full rounded border border-line px-2 py-1" {...register("note")} />
              </Field>
              {issue.isError && !(issue.error instanceof ApiError && issue.error.errors.some((e) => e.field === "note")) && (
                <FormMessage kind="error">
                  {issue.error.message}
                  {isConflict(issue.error) && (
                    <>
                      {" "}
                      <button
                        type="button"
                        className="btn-quiet"
                        onClick={() => {
                          issue.reset();
                          void queryClient.invalidateQueries({ queryKey: ["results", projectId] });
                        }}
                      >
                        Reload the options
                      </button>
                    </>
                  )}
                </FormMessage>
              )}
              <div className="flex flex-wrap gap-2">
                <button type="submit" className="btn" disabled={issue.isPending || approved.length === 0} data-testid="issue-submit">
                  {issue.isPending ? "Issuing…" : "Issue revision"}
                </button>
                <button type="button" className="btn-quiet" onClick={() => dialog.current?.close()}>
                  Cancel
                </button>
              </div>
            </form>
          )}
        </div>
      </dialog>
    </>
  );
}
