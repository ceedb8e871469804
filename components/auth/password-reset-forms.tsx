"use client";
import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { authClient } from "@/lib/auth-client";
import { authErrorMessage, forgotSchema, resetSchema } from "@/lib/schemas/auth";
import { errorsOf, useZodForm } from "./use-zod-form";

export function ForgotPasswordForm({ localInbox }: { localInbox: boolean }) {
  const [done, setDone] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const form = useZodForm(forgotSchema, { email: "" });
  const onSubmit = form.handleSubmit(async ({ email }) => {
    setError(null);
    const { error: err } = await authClient.requestPasswordReset({ email, redirectTo: "/reset-password" });
    if (err) return setError(authErrorMessage(err.code, err.status));
    setDone(true);
  });
  if (done) {
    return (
      <Notice tone="success" title="Check your inbox">
        If there is an account for that address, a reset link is on its way. It works for one hour.
        {localInbox ? (
          <>
            {" "}
            <Link href="/local-inbox">Open the local inbox</Link>.
          </>
        ) : null}
      </Notice>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Ask for a reset link">
      {error ? <Notice tone="error">{error}</Notice> : null}
      <Field label="E-mail" type="email" autoComplete="email" {...form.register("email")} errors={errorsOf(form.formState.errors.email)} />
      <div>
        <Button type="submit" disabled={form.formState.isSubmitting}>
          Send me a reset link
        </Button>
      </div>
    </form>
  );
}

export function ResetPasswordForm({ token }: { token: string }) {
  const [done, setDone] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const form = useZodForm(resetSchema, { password: "", confirm: "" });
  const onSubmit = form.handleSubmit(async ({ password }) => {
    setError(null);
    const { error: err } = await authClient.resetPassword({ newPassword: password, token });
    if (err) {
      form.reset({ password: "", confirm: "" });
      return setError(authErrorMessage(err.code, err.status));
    }
    setDone(true);
  });
  if (done) {
    return (
      <Notice tone="success" title="Password changed">
        You can now <Link href="/sign-in">sign in</Link> with your new password. Other devices were signed out.
      </Notice>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Choose a new password">
      {error ? (
        <Notice tone="error">
          {error} <Link href="/forgot-password">Ask for a new link</Link>.
        </Notice>
      ) : null}
      <Field label="New password" type="password" autoComplete="new-password" {...form.register("password")} errors={errorsOf(form.formState.errors.password)} />
      <Field label="New password again" type="password" autoComplete="new-password" {...form.register("confirm")} errors={errorsOf(form.formState.errors.confirm)} />
      <div>
        <Button type="submit" disabled={form.formState.isSubmitting}>
          Save my new password
        </Button>
      </div>
    </form>
  );
}
