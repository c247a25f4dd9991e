import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { SignInRequest } from "@/lib/contracts/auth";
import { authClient } from "@/lib/client/auth-client";
import { Field, FormMessage } from "./Field";
import { useHydrated } from "./useHydrated";

type Values = { email: string; password: string };

/** Only same-site paths are followed after sign-in. */
export function safeNext(next: string | null | undefined): string {
  return next && next.startsWith("/") && !next.startsWith("//") ? next : "/dashboard";
}

export default function SignInForm({ next, email }: { next?: string; email?: string }) {
  const hydrated = useHydrated();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<Values>({
    resolver: zodResolver(SignInRequest),
    defaultValues: { email: email ?? "", password: "" },
  });
  const onSubmit = handleSubmit(async (v) => {
    setFailure(null);
    const { error } = await authClient.signIn.email({ email: v.email, password: v.password });
    if (error) {
      setFailure(
        error.status === 401 || error.code === "INVALID_EMAIL_OR_PASSWORD"
          ? "Wrong e-mail or password."
          : error.code === "EMAIL_NOT_VERIFIED"
            ? "Confirm your e-mail address first: we sent you a new link."
            : (error.message ?? "Sign-in failed."),
      );
      return;
    }
    window.location.assign(safeNext(next));
  });
  return (
    <form method="post" onSubmit={onSubmit} className="space-y-4" noValidate>
      {failure && <FormMessage kind="error">{failure}</FormMessage>}
      <Field label="E-mail" htmlFor="email" error={formState.errors.email}>
        <input id="email" type="email" autoComplete="username" {...register("email")} />
      </Field>
      <Field label="Password" htmlFor="password" error={formState.errors.password}>
        <input id="password" type="password" autoComplete="current-password" {...register("password")} />
      </Field>
      <button type="submit" className="btn w-full justify-center" disabled={!hydrated || formState.isSubmitting}>
        {formState.isSubmitting ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}
