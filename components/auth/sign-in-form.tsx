"use client";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { authClient } from "@/lib/auth-client";
import { authErrorMessage, magicLinkSchema, signInSchema } from "@/lib/schemas/auth";
import { errorsOf, useZodForm } from "./use-zod-form";

export function SignInForm({ next, initialError, localInbox }: { next: string; initialError?: string; localInbox: boolean }) {
  const router = useRouter();
  const [mode, setMode] = useState<"password" | "link">("password");
  const [message, setMessage] = useState<{ tone: "error" | "success"; text: string } | null>(
    initialError ? { tone: "error", text: initialError } : null,
  );
  const pw = useZodForm(signInSchema, { email: "", password: "" });
  const link = useZodForm(magicLinkSchema, { email: "" });

  const onPassword = pw.handleSubmit(async (values) => {
    setMessage(null);
    const { data, error } = await authClient.signIn.email({ email: values.email, password: values.password, callbackURL: next });
    if (error) {
      pw.resetField("password");
      setMessage({ tone: "error", text: authErrorMessage(error.code, error.status) });
      return;
    }
    // With a callbackURL the auth client already loads that page itself (data.redirect); a second,
    // client-side navigation on top of it raced it and could land after the page had opened.
    if (data && "redirect" in data && data.redirect) return;
    router.push(next);
    router.refresh();
  });

  const onLink = link.handleSubmit(async (values) => {
    setMessage(null);
    const { error } = await authClient.signIn.magicLink({
      email: values.email,
      callbackURL: next,
      errorCallbackURL: "/sign-in?error=link",
    });
    if (error) {
      setMessage({ tone: "error", text: authErrorMessage(error.code, error.status) });
      return;
    }
    setMessage({
      tone: "success",
      text: "If there is an account for that address, a sign-in link is on its way. It works for 10 minutes.",
    });
  });

  return (
    <div className="flex flex-col gap-5">
      <div role="group" aria-label="How to sign in" className="flex gap-2">
        <Button variant={mode === "password" ? "primary" : "secondary"} aria-pressed={mode === "password"} onClick={() => setMode("password")}>
          Password
        </Button>
        <Button variant={mode === "link" ? "primary" : "secondary"} aria-pressed={mode === "link"} onClick={() => setMode("link")}>
          E-mail me a link
        </Button>
      </div>
      {message ? (
        <Notice tone={message.tone}>
          {message.text}
          {message.tone === "success" && localInbox ? (
            <>
              {" "}
              <Link href="/local-inbox">Open the local inbox</Link>.
            </>
          ) : null}
        </Notice>
      ) : null}
      {mode === "password" ? (
        <form onSubmit={onPassword} noValidate className="flex flex-col gap-4" aria-label="Sign in with password">
          <Field label="E-mail" type="email" autoComplete="email" {...pw.register("email")} errors={errorsOf(pw.formState.errors.email)} />
          <Field
            label="Password"
            type="password"
            autoComplete="current-password"
            {...pw.register("password")}
            errors={errorsOf(pw.formState.errors.password)}
          />
          <div className="flex flex-wrap items-center gap-4">
            <Button type="submit" disabled={pw.formState.isSubmitting}>
              {pw.formState.isSubmitting ? "Signing in…" : "Sign in"}
            </Button>
            <Link href="/forgot-password">Forgot your password?</Link>
          </div>
        </form>
      ) : (
        <form onSubmit={onLink} noValidate className="flex flex-col gap-4" aria-label="Sign in with an e-mail link">
          <Field label="E-mail" type="email" autoComplete="email" {...link.register("email")} errors={errorsOf(link.formState.errors.email)} />
          <div>
            <Button type="submit" disabled={link.formState.isSubmitting}>
              Send me a sign-in link
            </Button>
          </div>
        </form>
      )}
    </div>
  );
}
