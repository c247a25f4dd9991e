/**
 * The review panel of one façade option: its comment thread (with replies), approve / reject with an
 * optional note for those who decide, and the option's decision history. Reads and writes through the
 * REST API; the forms validate with the endpoints' own schemas.
 */
import { useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { api, ApiError } from "@/lib/client/api";
import { withQueryClient } from "@/lib/client/query";
import { CommentRequest, DecisionRequest, type CommentView, type DecisionResponse, type DecisionView } from "@/lib/contracts/review";
import { z } from "@/lib/contracts/zod";

interface Props {
  optionId: string;
  canComment: boolean;
  canDecide: boolean;
}

interface Thread {
  status: "proposed" | "approved" | "rejected";
  comments: CommentView[];
  decisions: DecisionView[];
}

const when = (iso: string) => new Date(iso).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" });
const STATUS_LABEL = { proposed: "Under review", approved: "Approved", rejected: "Rejected" } as const;

type CommentForm = z.input<typeof CommentRequest>;

function CommentBox({ optionId, parentId, onDone, label }: { optionId: string; parentId?: string; onDone?: () => void; label: string }) {
  const qc = useQueryClient();
  const form = useForm<CommentForm, unknown, z.output<typeof CommentRequest>>({
    resolver: zodResolver(CommentRequest),
    defaultValues: { body: "", parentId },
  });
  const post = useMutation({
    mutationFn: (b: z.output<typeof CommentRequest>) => api<CommentView>("POST", `/api/v1/options/${optionId}/comments`, b),
    onSuccess: async () => {
      form.reset({ body: "", parentId });
      await qc.invalidateQueries({ queryKey: ["option-review", optionId] });
      onDone?.();
    },
  });
  const err = form.formState.errors.body?.message ?? (post.error instanceof ApiError ? post.error.message : post.error ? String(post.error) : null);
  const id = `comment-${optionId}-${parentId ?? "new"}`;
  return (
    <form className="space-y-2" onSubmit={form.handleSubmit((b) => post.mutate(b))} noValidate>
      <label htmlFor={id} className="text-sm font-medium">
        {label}
      </label>
      <textarea id={id} rows={3} className="w-full rounded border border-slate-300 p-2 text-sm" aria-invalid={!!err} {...form.register("body")} />
      {err && (
        <p role="alert" className="text-sm text-red-700">
          {err}
        </p>
      )}
      <button type="submit" className="btn" disabled={post.isPending}>
        {post.isPending ? "Sending…" : parentId ? "Reply" : "Comment"}
      </button>
    </form>
  );
}

function Comment({ c, replies, optionId, canComment }: { c: CommentView; replies: CommentView[]; optionId: string; canComment: boolean }) {
  const [replying, setReplying] = useState(false);
  return (
    <li className="space-y-1">
      <p className="text-xs text-slate-600">
        <strong className="text-slate-900">{c.author.name}</strong> · <time dateTime={c.createdAt}>{when(c.createdAt)}</time>
      </p>
      <p className="whitespace-pre-wrap text-sm">{c.body}</p>
      {canComment && !replying && (
        <button type="button" className="text-sm underline" onClick={() => setReplying(true)}>
          Reply
        </button>
      )}
      {replying && <CommentBox optionId={optionId} parentId={c.id} label={`Reply to ${c.author.name}`} onDone={() => setReplying(false)} />}
      {replies.length > 0 && (
        <ul className="ml-4 space-y-3 border-l-2 border-slate-200 pl-3">
          {replies.map((r) => (
            <Comment key={r.id} c={r} replies={[]} optionId={optionId} canComment={false} />
          ))}
        </ul>
      )}
    </li>
  );
}

function DecisionBox({ optionId, status }: { optionId: string; status: Thread["status"] }) {
  const qc = useQueryClient();
  const [said, setSaid] = useState<string | null>(null);
  const form = useForm<z.input<typeof DecisionRequest>, unknown, z.output<typeof DecisionRequest>>({
    resolver: zodResolver(DecisionRequest),
    defaultValues: { decision: "approved", note: "" },
  });
  const decide = useMutation({
    mutationFn: (b: z.output<typeof DecisionRequest>) => api<DecisionResponse>("POST", `/api/v1/options/${optionId}/decision`, b),
    onSuccess: async (r) => {
      setSaid(
        `${STATUS_LABEL[r.option.status]}.${r.previouslyApproved ? ` “${r.previouslyApproved.name}” is no longer approved for this façade.` : ""}`,
      );
      form.reset({ decision: "approved", note: "" });
      await qc.invalidateQueries({ queryKey: ["option-review"] });
    },
  });
  const submit = (decision: "approved" | "rejected") => {
    form.setValue("decision", decision);
    void form.handleSubmit((b) => decide.mutate(b))();
  };
  const err = form.formState.errors.note?.message ?? (decide.error instanceof Error ? decide.error.message : null);
  const noteId = `decision-note-${optionId}`;
  return (
    <div className="space-y-2">
      <label htmlFor={noteId} className="text-sm font-medium">
        Note with the decision (optional)
      </label>
      <textarea id={noteId} rows={2} className="w-full rounded border border-slate-300 p-2 text-sm" {...form.register("note")} />
      <div className="flex flex-wrap gap-2">
        <button type="button" className="btn" disabled={decide.isPending || status === "approved"} onClick={() => submit("approved")}>
          Approve
        </button>
        <button type="button" className="btn btn-quiet" disabled={decide.isPending || status === "rejected"} onClick={() => submit("rejected")}>
          Reject
        </button>
      </div>
      {err && (
        <p role="alert" className="text-sm text-red-700">
          {err}
        </p>
      )}
      {said && (
        <p role="status" className="text-sm text-emerald-800">
          {said}
        </p>
      )}
    </div>
  );
}

function OptionReview({ optionId, canComment, canDecide }: Props) {
  const q = useQuery({ queryKey: ["option-review", optionId], queryFn: () => api<Thread>("GET", `/api/v1/options/${optionId}/comments`) });
  if (q.isPending) return <p className="text-sm text-slate-600">Loading the review…</p>;
  if (q.isError)
    return (
      <p role="alert" className="text-sm text-red-700">
        The review could not be loaded: {q.error.message}{" "}
        <button type="button" className="underline" onClick={() => void q.refetch()}>
          Try again
        </button>
      </p>
    );
  const { comments, decisions, status } = q.data;
  const roots = comments.filter((c) => !c.parentId);
  return (
    <section className="space-y-4" aria-label="Review">
      <p className="text-sm">
        Status:{" "}
        <strong data-testid="option-status" className={status === "approved" ? "text-emerald-800" : status === "rejected" ? "text-red-800" : ""}>
          {STATUS_LABEL[status]}
        </strong>
      </p>
      {canDecide && <DecisionBox optionId={optionId} status={status} />}
      <div>
        <h4 className="text-sm font-semibold">Comments</h4>
        {roots.length === 0 ? (
          <p className="text-sm text-slate-600">No comments yet.</p>
        ) : (
          <ul className="mt-2 space-y-4">
            {roots.map((c) => (
              <Comment key={c.id} c={c} replies={comments.filter((r) => r.parentId === c.id)} optionId={optionId} canComment={canComment} />
            ))}
          </ul>
        )}
      </div>
      {canComment && <CommentBox optionId={optionId} label="New comment" />}
      {decisions.length > 0 && (
        <div>
          <h4 className="text-sm font-semibold">Decisions</h4>
          <ol className="mt-1 space-y-1 text-sm">
            {decisions.map((d) => (
              <li key={d.id}>
                {STATUS_LABEL[d.decision]} by {d.decidedBy}, <time dateTime={d.at}>{when(d.at)}</time>
                {d.note ? ` — ${d.note}` : ""}
              </li>
            ))}
          </ol>
        </div>
      )}
    </section>
  );
}

export default withQueryClient(OptionReview);
