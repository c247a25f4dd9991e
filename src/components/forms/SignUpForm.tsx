import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { SignUpRequest } from "@/lib/contracts/auth";
import { api, ApiError } from "@/lib/client/api";
import { applyServerErrors, Field, FormMessage } from "./Field";
import { useHydrated } from "./useHydrated";

type Values = { name: string; email: string; password: string; organizationName?: string; invitationId?: string };

interface Props {
  /** When set, the account joins this invitation's organisation instead of founding one. */
  invitation?: { id: string; email: string; organizationName: string; roleLabel: string };
}

export default function SignUpForm({ invitation }: Props) {
  const hydrated = useHydrated();
  const [failure, setFailure] = useState<string | null>(null);
  const [sent, setSent] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<Values>({
    resolver: zodResolver(SignUpRequest) as never,
    defaultValues: {
      name: "",
      email: invitation?.email ?? "",
      password: "",
      organizationName: invitation ? undefined : "",
      invitationId: invitation?.id,
    },
  });
  const onSubmit = handleSubmit(async (v) => {
    setFailure(null);
    try {
      const res = await api<{ status?: string; message?: string }>("POST", "/api/v1/signup", invitation ? { ...v, organizationName: undefined } : v);
      if (res?.status === "verification-sent") setSent(res.message ?? "Check your inbox to confirm your e-mail address.");
      else window.location.assign("/dashboard");
    } catch (e) {
      const err = e instanceof ApiError ? e : new ApiError(0, String(e));
      if (!applyServerErrors(err.errors, ["name", "email", "password", "organizationName"], setError)) setFailure(err.message);
      else setFailure(err.message);
    }
  });
  if (sent) return <FormMessage kind="ok">{sent}</FormMessage>;
  return (
    <form method="post" onSubmit={onSubmit} className="space-y-4" noValidate>
      {failure && <FormMessage kind="error">{failure}</FormMessage>}
      <Field label="Your name" htmlFor="name" error={formState.errors.name}>
        <input id="name" autoComplete="name" {...register("name")} />
      </Field>
      <Field label="Work e-mail" htmlFor="email" error={formState.errors.email}>
        <input id="email" type="email" autoComplete="email" readOnly={!!invitation} {...register("email")} />
      </Field>
      <Field label="Password" htmlFor="password" error={formState.errors.password} hint="At least 8 characters.">
        <input id="password" type="password" autoComplete="new-password" {...register("password")} />
      </Field>
      {invitation ? (
        <p className="text-sm text-slate">
          You will join <strong>{invitation.organizationName}</strong> as <strong>{invitation.roleLabel}</strong>.
        </p>
      ) : (
        <Field
          label="Your firm"
          htmlFor="organizationName"
          error={formState.errors.organizationName}
          hint="A new organisation is created with you as its owner."
        >
          <input id="organizationName" autoComplete="organization" {...register("organizationName")} />
        </Field>
      )}
      <button type="submit" className="btn w-full justify-center" disabled={!hydrated || formState.isSubmitting}>
        {formState.isSubmitting ? "Creating your account…" : invitation ? "Create account and join" : "Create account"}
      </button>
    </form>
  );
}
