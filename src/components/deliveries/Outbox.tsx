import { useState } from "react";
import { useInfiniteQuery, useMutation, useQueryClient } from "@tanstack/react-query";
import { useForm, type FieldErrors, type Resolver } from "react-hook-form";
import { api, ApiError } from "@/lib/client/api";
import { withQueryClient } from "@/lib/client/query";
import {
  DeliveryRequest,
  MAX_DELIVERY_RECIPIENTS,
  splitAddresses,
  type DeliveryMemberChoice,
  type DeliveryRequestBody,
  type DeliveryResponse,
  type DeliveryStatus,
} from "@/lib/contracts/deliveries";
import { Field, FormMessage } from "@/components/forms/Field";

interface Props {
  projectId: string;
  revisions: { letter: string; issuedAt: string }[];
  members: DeliveryMemberChoice[];
}

interface FormValues {
  revision: string;
  addresses: string;
  memberIds: string[];
  message: string;
}

/** The form's fields as the request the endpoint reads (then checked by the endpoint's own schema). */
const requestOf = (v: FormValues) => ({
  revision: v.revision,
  to: splitAddresses(v.addresses),
  // One checkbox alone gives its value (or false) rather than a list.
  memberIds: [v.memberIds as unknown].flat().filter((x): x is string => typeof x === "string" && x !== ""),
  message: v.message,
});

/** Which form field a request field's message belongs to. */
const formField = (path: readonly PropertyKey[]): keyof FormValues => {
  const head = String(path[0] ?? "addresses");
  return head === "to" ? "addresses" : head === "memberIds" ? "memberIds" : head === "revision" || head === "message" ? head : "addresses";
};

const wordsFor = (path: readonly PropertyKey[], message: string) =>
  path[0] === "to" && typeof path[1] === "number" ? `Address ${path[1] + 1}: ${message.replace(/^email /, "")}` : message;

const resolver: Resolver<FormValues, unknown, DeliveryRequestBody> = async (values) => {
  const parsed = DeliveryRequest.safeParse(requestOf(values));
  if (parsed.success) return { values: parsed.data, errors: {} };
  const errors: FieldErrors<FormValues> = {};
  for (const i of parsed.error.issues) {
    const f = formField(i.path);
    if (!errors[f]) errors[f] = { type: "validate", message: wordsFor(i.path, i.message) };
  }
  return { values: {}, errors };
};

const STATUS_WORDS: Record<DeliveryStatus, string> = { queued: "Queued", sending: "Sending", sent: "Sent", failed: "Failed" };
const STATUS_STYLE: Record<DeliveryStatus, string> = {
  queued: "bg-slate-100 text-slate-700",
  sending: "bg-amber-100 text-amber-900",
  sent: "bg-emerald-100 text-emerald-900",
  failed: "bg-red-100 text-red-900",
};
const when = (iso: string) => new Date(iso).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" });

type Page = { deliveries: DeliveryResponse[]; nextCursor: string | null };

function Outbox({ projectId, revisions, members }: Props) {
  const qc = useQueryClient();
  const key = ["deliveries", projectId];
  const list = useInfiniteQuery({
    queryKey: key,
    initialPageParam: null as string | null,
    queryFn: ({ pageParam }) =>
      api<Page>("GET", `/api/v1/projects/${projectId}/deliveries${pageParam ? `?cursor=${encodeURIComponent(pageParam)}` : ""}`),
    getNextPageParam: (last) => last.nextCursor,
    // While something is on its way, look again every two seconds.
    refetchInterval: (q) =>
      q.state.data?.pages.some((p) => p.deliveries.some((d) => d.status === "queued" || d.status === "sending")) ? 2000 : false,
  });
  const [queued, setQueued] = useState<string | null>(null);
  const form = useForm<FormValues, unknown, DeliveryRequestBody>({
    resolver,
    defaultValues: { revision: revisions[0]?.letter ?? "", addresses: "", memberIds: [], message: "" },
  });
  const send = useMutation({
    mutationFn: (body: DeliveryRequestBody) => api<{ id: string; status: DeliveryStatus }>("POST", `/api/v1/projects/${projectId}/deliveries`, body),
    onSuccess: (_res, body) => {
      setQueued(`Revision ${body.revision} is queued for ${body.to.length + body.memberIds.length} recipient(s); its status follows below.`);
      form.reset({ ...form.getValues(), addresses: "", memberIds: [], message: "" });
      void qc.invalidateQueries({ queryKey: key });
    },
    onError: (err) => {
      setQueued(null);
      if (err instanceof ApiError)
        for (const e of err.errors) {
          const path = e.field.split(/[.[\]]+/).filter(Boolean);
          form.setError(formField(path), { type: "server", message: e.message });
        }
    },
  });
  const errors = form.formState.errors;
  const deliveries = list.data?.pages.flatMap((p) => p.deliveries) ?? [];

  return (
    <div className="space-y-6">
      <section className="card space-y-4" aria-labelledby="send-heading">
        <h2 id="send-heading">Send a workbook</h2>
        {revisions.length === 0 ? (
          <p className="text-sm text-slate">No revision has been issued yet; issue one from the results page, then send it from here.</p>
        ) : (
          <form className="space-y-4" noValidate onSubmit={form.handleSubmit((body) => send.mutate(body))}>
            <Field label="Revision" htmlFor="outbox-revision" error={errors.revision}>
              <select id="outbox-revision" {...form.register("revision")}>
                {revisions.map((r) => (
                  <option key={r.letter} value={r.letter}>
                    Revision {r.letter} (issued {when(r.issuedAt)})
                  </option>
                ))}
              </select>
            </Field>
            <fieldset className="space-y-2">
              <legend className="text-sm font-semibold">Members</legend>
              {members.length === 0 ? (
                <p className="text-sm text-slate">Nobody in the organisation receives this project's exports yet.</p>
              ) : (
                <ul className="grid gap-1 sm:grid-cols-2">
                  {members.map((m) => (
                    <li key={m.memberId}>
                      <label className="mt-0 flex items-start gap-2 text-sm font-normal">
                        <input type="checkbox" className="mt-0.5 w-auto shrink-0" value={m.memberId} {...form.register("memberIds")} />
                        <span className="min-w-0 break-words">
                          {m.name}{" "}
                          <span className="text-slate">
                            ({m.role}, {m.email})
                          </span>
                        </span>
                      </label>
                    </li>
                  ))}
                </ul>
              )}
              {errors.memberIds?.message && (
                <p className="field-error" role="alert">
                  {errors.memberIds.message}
                </p>
              )}
            </fieldset>
            <Field
              label="Other addresses"
              htmlFor="outbox-addresses"
              error={errors.addresses}
              hint={`Separate addresses with commas or line breaks; at most ${MAX_DELIVERY_RECIPIENTS} recipients in all.`}
            >
              <textarea id="outbox-addresses" rows={2} {...form.register("addresses")} />
            </Field>
            <Field label="Message (optional)" htmlFor="outbox-message" error={errors.message}>
              <textarea id="outbox-message" rows={4} {...form.register("message")} />
            </Field>
            {send.isError && !(send.error instanceof ApiError && send.error.errors.length) && (
              <FormMessage kind="error">{send.error.message}</FormMessage>
            )}
            {queued && <FormMessage kind="ok">{queued}</FormMessage>}
            <button className="btn" type="submit" disabled={send.isPending}>
              {send.isPending ? "Queuing…" : "Send workbook"}
            </button>
          </form>
        )}
      </section>

      <section className="card space-y-3" aria-labelledby="sent-heading">
        <h2 id="sent-heading">Deliveries</h2>
        {list.isPending ? (
          <p className="text-sm text-slate">Loading the deliveries…</p>
        ) : list.isError ? (
          <FormMessage kind="error">The deliveries could not be loaded: {list.error.message}</FormMessage>
        ) : deliveries.length === 0 ? (
          <p className="text-sm text-slate">Nothing has been sent from this project yet.</p>
        ) : (
          <div className="overflow-x-auto">
            <table className="w-full text-sm" data-testid="deliveries">
              <thead>
                <tr className="text-left">
                  <th className="p-2">Started</th>
                  <th className="p-2">Revision</th>
                  <th className="p-2">Recipients</th>
                  <th className="p-2">Status</th>
                  <th className="p-2">Attempts</th>
                  <th className="p-2">Workbook</th>
                </tr>
              </thead>
              <tbody>
                {deliveries.map((d) => (
                  <tr key={d.id} className="border-t border-slate-100 align-top" data-delivery={d.id} data-status={d.status}>
                    <td className="p-2 whitespace-nowrap">
                      <time dateTime={d.createdAt}>{when(d.createdAt)}</time>
                      <div className="text-xs text-slate">by {d.createdBy}</div>
                    </td>
                    <td className="p-2">{d.revision}</td>
                    <td className="p-2 min-w-48 break-words">{d.recipients.map((r) => (r.name ? `${r.name} <${r.email}>` : r.email)).join(", ")}</td>
                    <td className="p-2 min-w-40">
                      <span className={`rounded px-2 py-0.5 text-xs font-semibold ${STATUS_STYLE[d.status]}`}>{STATUS_WORDS[d.status]}</span>
                      {d.sentAt && <div className="text-xs text-slate">at {when(d.sentAt)}</div>}
                      {d.lastError && (
                        <div className={`mt-1 text-xs break-words ${d.status === "failed" ? "text-alert" : "text-slate"}`}>
                          {d.status === "failed" ? "Gave up: " : "Last attempt: "}
                          {d.lastError}
                        </div>
                      )}
                    </td>
                    <td className="p-2">{d.attempts}</td>
                    <td className="p-2">
                      {d.attachment ? (
                        <a className="underline" href={`/api/v1/deliveries/${d.id}/attachment`} download={d.attachment.fileName}>
                          {d.attachment.fileName}
                        </a>
                      ) : (
                        <span className="text-slate">not built yet</span>
                      )}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
        {list.hasNextPage && (
          <button className="btn-quiet" type="button" disabled={list.isFetchingNextPage} onClick={() => void list.fetchNextPage()}>
            {list.isFetchingNextPage ? "Loading…" : "Older deliveries"}
          </button>
        )}
      </section>
    </div>
  );
}

export default withQueryClient(Outbox);
