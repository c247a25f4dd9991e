import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "@/lib/contracts/zod";
import { email, password } from "@/lib/contracts/common";
import { authClient } from "@/lib/client/auth-client";
import { Field, FormMessage } from "./Field";
import { useHydrated } from "./useHydrated";

const RequestSchema = z.object({ email });

export function RequestResetForm() {
  const hydrated = useHydrated();
  const [sent, setSent] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<{ email: string }>({ resolver: zodResolver(RequestSchema), defaultValues: { email: "" } });
  const onSubmit = handleSubmit(async (v) => {
    setFailure(null);
    const { error } = await authClient.requestPasswordReset({ email: v.email, redirectTo: "/reset-password" });
    if (error) setFailure(error.message ?? "Could not send the e-mail; try again.");
    else setSent(true);
  });
  if (sent) {
    return (
      <FormMessage kind="ok">
        If an account exists for that address, we have sent it a link to choose a new password. The link is valid for one hour.
      </FormMessage>
    );
  }
  return (
    <form method="post" onSubmit={onSubmit} className="space-y-4" noValidate>
      {failure && <FormMessage kind="error">{failure}</FormMessage>}
      <Field label="E-mail" htmlFor="email" error={formState.errors.email}>
        <input id="email" type="email" autoComplete="email" {...register("email")} />
      </Field>
      <button type="submit" className="btn w-full justify-center" disabled={!hydrated || formState.isSubmitting}>
        Send me a reset link
      </button>
    </form>
  );
}

const ResetSchema = z
  .object({ password, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "the two passwords differ" });

export function ResetPasswordForm({ token }: { token: string }) {
  const hydrated = useHydrated();
  const [done, setDone] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<{ password: string; confirm: string }>({
    resolver: zodResolver(ResetSchema),
    defaultValues: { password: "", confirm: "" },
  });
  const onSubmit = handleSubmit(async (v) => {
    setFailure(null);
    const { error } = await authClient.resetPassword({ newPassword: v.password, token });
    if (error)
      setFailure(
        error.code === "INVALID_TOKEN" ? "This reset link is invalid or has expired; ask for a new one." : (error.message ?? "Reset failed."),
      );
    else setDone(true);
  });
  if (done) {
    return (
      <FormMessage kind="ok">
        Your password has been changed. <a href="/signin">Sign in</a> with the new one.
      </FormMessage>
    );
  }
  return (
    <form method="post" onSubmit={onSubmit} className="space-y-4" noValidate>
      {failure && <FormMessage kind="error">{failure}</FormMessage>}
      <Field label="New password" htmlFor="password" error={formState.errors.password} hint="At least 8 characters.">
        <input id="password" type="password" autoComplete="new-password" {...register("password")} />
      </Field>
      <Field label="Repeat the new password" htmlFor="confirm" error={formState.errors.confirm}>
        <input id="confirm" type="password" autoComplete="new-password" {...register("confirm")} />
      </Field>
      <button type="submit" className="btn w-full justify-center" disabled={!hydrated || formState.isSubmitting}>
        Set new password
      </button>
    </form>
  );
}
