import type { ReactNode } from "react";
import type { FieldError as RhfFieldError } from "react-hook-form";
import type { FieldError } from "@/lib/contracts/problem";

/** A labelled form control with its validation message. */
export function Field(props: { label: string; htmlFor: string; error?: RhfFieldError | { message?: string }; hint?: string; children: ReactNode }) {
  return (
    <div>
      <label htmlFor={props.htmlFor}>{props.label}</label>
      {props.children}
      {props.hint && !props.error && <p className="mt-1 text-xs text-slate">{props.hint}</p>}
      {props.error?.message && (
        <p className="field-error" role="alert" data-field={props.htmlFor}>
          {props.error.message}
        </p>
      )}
    </div>
  );
}

/** A form-level message (server refusal, network failure or success). */
export function FormMessage({ kind, children }: { kind: "error" | "ok"; children: ReactNode }) {
  return (
    <div
      role={kind === "error" ? "alert" : "status"}
      className={
        kind === "error"
          ? "rounded border border-alert/30 bg-alert/5 px-3 py-2 text-sm text-alert"
          : "rounded border border-glass/30 bg-glass-light px-3 py-2 text-sm text-glass"
      }
    >
      {children}
    </div>
  );
}

/** Copies server field errors (problem+json `errors`) onto the form's fields where names match. */
export function applyServerErrors(
  errors: readonly FieldError[],
  fields: readonly string[],
  setError: (name: never, error: { type: string; message: string }) => void,
): boolean {
  let applied = false;
  for (const e of errors) {
    if (fields.includes(e.field)) {
      setError(e.field as never, { type: "server", message: e.message });
      applied = true;
    }
  }
  return applied;
}
