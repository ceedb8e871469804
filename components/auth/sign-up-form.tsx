"use client";
import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { authClient } from "@/lib/auth-client";
import { authErrorMessage, signUpSchema } from "@/lib/schemas/auth";
import { errorsOf, useZodForm } from "./use-zod-form";

export function SignUpForm({
  callbackURL,
  presetEmail,
  studioName,
  localInbox,
}: {
  callbackURL: string;
  presetEmail?: string;
  studioName?: string;
  localInbox: boolean;
}) {
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const form = useZodForm(signUpSchema, { name: "", email: presetEmail ?? "", password: "", confirm: "" });

  const onSubmit = form.handleSubmit(async (values) => {
    setError(null);
    const { error: err } = await authClient.signUp.email({
      name: values.name,
      email: values.email,
      password: values.password,
      callbackURL,
    });
    if (err) {
      form.resetField("password");
      form.resetField("confirm");
      setError(authErrorMessage(err.code, err.status));
      return;
    }
    setSentTo(values.email);
  });

  if (sentTo) {
    return (
      <Notice tone="success" title="Check your inbox">
        We sent a link to <strong>{sentTo}</strong>. Open it to confirm your address and you will be signed in
        {studioName ? ` and connected to ${studioName}` : ""}.
        {localInbox ? (
          <>
            {" "}
            This demo keeps mail in the <Link href="/local-inbox">local inbox</Link>.
          </>
        ) : null}
      </Notice>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Create an account">
      {error ? <Notice tone="error">{error}</Notice> : null}
      <Field label="Your name" autoComplete="name" {...form.register("name")} errors={errorsOf(form.formState.errors.name)} />
      <Field
        label="E-mail"
        type="email"
        autoComplete="email"
        readOnly={Boolean(presetEmail)}
        {...form.register("email")}
        errors={errorsOf(form.formState.errors.email)}
      />
      <Field
        label="Password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters. A few unrelated words make a strong one."
        {...form.register("password")}
        errors={errorsOf(form.formState.errors.password)}
      />
      <Field
        label="Password again"
        type="password"
        autoComplete="new-password"
        {...form.register("confirm")}
        errors={errorsOf(form.formState.errors.confirm)}
      />
      <div>
        <Button type="submit" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? "Creating…" : "Create my account"}
        </Button>
      </div>
    </form>
  );
}
