import Link from "next/link";
import { ResetPasswordForm } from "@/components/auth/password-reset-forms";
import { PageTitle } from "@/components/ui/card";
import { Notice } from "@/components/ui/notice";

export const metadata = { title: "Choose a new password" };

export default async function ResetPasswordPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const { token, error } = await searchParams;
  return (
    <>
      <PageTitle title="Choose a new password" />
      {error || !token ? (
        <Notice tone="error" title="This reset link does not work">
          It has expired (links last one hour) or was already used. <Link href="/forgot-password">Ask for a new link</Link>.
        </Notice>
      ) : (
        <ResetPasswordForm token={token} />
      )}
    </>
  );
}
