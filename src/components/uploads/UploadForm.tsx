/**
 * Sending a CSV file to an upload endpoint: a drop zone and a file button, a progress bar while the file goes
 * up (XMLHttpRequest upload progress), the problems of a refused file as a table of line, column and message,
 * and the saved answer handed to the caller to show.
 */
import { useId, useRef, useState, type ReactNode } from "react";
import type { UploadError } from "@/lib/contracts/uploads";
import { MAX_UPLOAD_BYTES } from "@/lib/contracts/uploads";
import { useHydrated } from "@/components/forms/useHydrated";

type Status =
  | { kind: "idle" }
  | { kind: "sending"; fileName: string; sent: number; total: number }
  | { kind: "refused"; fileName: string; message: string; errors: UploadError[] }
  | { kind: "saved"; fileName: string; body: unknown };

interface Props<T> {
  /** Endpoint that takes the multipart upload (field `file`). */
  action: string;
  /** What the file is, for labels: "panes file", "weather file". */
  noun: string;
  templateHref: string;
  /** One or two sentences on the columns. */
  help: ReactNode;
  /** What was saved, from the 201 answer. */
  renderSaved: (body: T) => ReactNode;
  onSaved?: (body: T) => void;
  testId?: string;
}

const MB = 1024 * 1024;

export default function UploadForm<T>({ action, noun, templateHref, help, renderSaved, onSaved, testId }: Props<T>) {
  const [status, setStatus] = useState<Status>({ kind: "idle" });
  const [over, setOver] = useState(false);
  // Until the island runs, a chosen file would go nowhere: the button waits for it.
  const hydrated = useHydrated();
  const input = useRef<HTMLInputElement>(null);
  const id = useId();

  function send(file: File) {
    if (file.size > MAX_UPLOAD_BYTES) {
      setStatus({
        kind: "refused",
        fileName: file.name,
        message: `This file is ${(file.size / MB).toFixed(1)} MB; the limit is ${MAX_UPLOAD_BYTES / MB} MB. Nothing was sent.`,
        errors: [],
      });
      return;
    }
    const form = new FormData();
    form.set("file", file, file.name);
    const xhr = new XMLHttpRequest();
    xhr.open("POST", action);
    xhr.responseType = "text";
    xhr.upload.onprogress = (e) =>
      setStatus({ kind: "sending", fileName: file.name, sent: e.loaded, total: e.lengthComputable ? e.total : file.size });
    xhr.onerror = () =>
      setStatus({
        kind: "refused",
        fileName: file.name,
        message: "The server could not be reached; check your connection and try again.",
        errors: [],
      });
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        body = null;
      }
      if (xhr.status === 201) {
        setStatus({ kind: "saved", fileName: file.name, body });
        onSaved?.(body as T);
        return;
      }
      const p = (body ?? {}) as { detail?: string; errors?: (UploadError | { field: string; message: string })[] };
      const errors = (p.errors ?? []).filter((e): e is UploadError => "line" in e);
      setStatus({ kind: "refused", fileName: file.name, message: p.detail ?? `The upload was refused (${xhr.status}).`, errors });
    };
    setStatus({ kind: "sending", fileName: file.name, sent: 0, total: file.size });
    xhr.send(form);
  }

  const pick = (files: FileList | null) => {
    const f = files?.[0];
    if (f) send(f);
    if (input.current) input.current.value = "";
  };

  return (
    <div className="space-y-3" data-testid={testId}>
      <div className="text-sm text-slate">{help}</div>
      <p className="text-sm">
        <a href={templateHref} download>
          Download a template {noun}
        </a>{" "}
        (CSV, invented example rows) · at most {MAX_UPLOAD_BYTES / MB} MB
      </p>
      <div
        className={`rounded-lg border-2 border-dashed p-4 text-center text-sm transition-colors ${over ? "border-glass bg-glass-light" : "border-line bg-paper"}`}
        onDragOver={(e) => {
          e.preventDefault();
          setOver(true);
        }}
        onDragLeave={() => setOver(false)}
        onDrop={(e) => {
          e.preventDefault();
          setOver(false);
          pick(e.dataTransfer.files);
        }}
        data-testid="drop-zone"
      >
        <p className="mb-2">Drop the {noun} here, or</p>
        <label htmlFor={id} className="btn-quiet cursor-pointer focus-within:outline-2 focus-within:outline-offset-2 focus-within:outline-glass">
          Choose a file…
          <input
            id={id}
            ref={input}
            type="file"
            accept=".csv,text/csv"
            className="sr-only"
            disabled={!hydrated || status.kind === "sending"}
            onChange={(e) => pick(e.target.files)}
          />
        </label>
      </div>

      {status.kind === "sending" && (
        <div role="status" aria-live="polite" className="space-y-1 text-sm">
          <p>
            Sending “{status.fileName}”… {status.total ? Math.round((100 * status.sent) / status.total) : 0} %
          </p>
          <progress className="h-2 w-full" max={status.total || 1} value={status.sent} aria-label={`Upload of ${status.fileName}`} />
        </div>
      )}
      {status.kind === "refused" && (
        <div role="alert" className="space-y-2" data-testid="upload-errors">
          <p className="text-sm text-alert">
            “{status.fileName}”: {status.message}
          </p>
          {status.errors.length > 0 && (
            <div className="max-h-80 overflow-auto rounded border border-line">
              <table className="w-full text-left text-sm">
                <caption className="sr-only">Problems in {status.fileName}</caption>
                <thead className="sticky top-0 bg-white text-slate">
                  <tr>
                    <th scope="col" className="px-2 py-1 text-right">
                      Line
                    </th>
                    <th scope="col" className="px-2 py-1">
                      Column
                    </th>
                    <th scope="col" className="px-2 py-1">
                      Problem
                    </th>
                  </tr>
                </thead>
                <tbody className="divide-y divide-line">
                  {status.errors.map((e, i) => (
                    <tr key={i}>
                      <td className="px-2 py-1 text-right font-mono">{e.line || "–"}</td>
                      <td className="px-2 py-1 font-mono text-xs break-all">{e.column}</td>
                      <td className="px-2 py-1">{e.message}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
        </div>
      )}
      {status.kind === "saved" && (
        <div role="status" className="space-y-2" data-testid="upload-saved">
          <p className="text-sm font-bold text-glass">“{status.fileName}” saved.</p>
          {renderSaved(status.body as T)}
        </div>
      )}
    </div>
  );
}
