import { ForgotPasswordForm } from "@/components/auth/password-reset-forms";
import { PageTitle } from "@/components/ui/card";
import { usesLocalMail } from "@/lib/env";

export const metadata = { title: "Forgot your password" };

export default function ForgotPasswordPage() {
  return (
    <>
      <PageTitle title="Forgot your password?" lead="We will e-mail you a link to choose a new one." />
      <ForgotPasswordForm localInbox={usesLocalMail()} />
    </>
  );
}
