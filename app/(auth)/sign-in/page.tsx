import Link from "next/link";
import { redirect } from "next/navigation";
import { SignInForm } from "@/components/auth/sign-in-form";
import { PageTitle } from "@/components/ui/card";
import { usesLocalMail } from "@/lib/env";
import { authErrorMessage, safeNext } from "@/lib/schemas/auth";
import { getActor } from "@/lib/server/authz";

export const metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const sp = await searchParams;
  const next = safeNext(sp.next);
  if (await getActor()) redirect(next);
  const initialError = sp.error
    ? sp.error === "link"
      ? "That sign-in link has expired or was already used. Ask for a new one."
      : authErrorMessage(sp.error)
    : sp.expired
      ? "Your session has ended. Sign in again and we will take you back."
      : undefined;
  return (
    <>
      <PageTitle title="Sign in" lead="Studios and their clients sign in here." />
      <SignInForm next={next} initialError={initialError} localInbox={usesLocalMail()} />
      <p className="mt-6">
        New here? <Link href={`/sign-up${sp.next ? `?next=${encodeURIComponent(next)}` : ""}`}>Create an account</Link>.
      </p>
    </>
  );
}
